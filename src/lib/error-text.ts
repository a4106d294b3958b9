import { i18n } from '../i18n';
import { isApiError } from './api-client';

/**
 * Server and schema messages in the interface language. The API answers `{"error": {code, message,
 * fields}}` in English (the shared zod schemas stay English); the client translates at display:
 * - a whole error by its stable `code` (`app:errors.code.<code>`), else by its HTTP status
 *   (`app:errors.status.<status>`), else the server's own text;
 * - a field's problem by its known English wording (`app:validation.*`), else the server's text.
 * In English the server's own message is shown as it is: it is already English and often the most
 * specific (a code such as `password_rejected` covers several reasons).
 */

const t = (key: string, options?: Record<string, unknown>) => i18n.t(key, { ns: 'app', ...options }) as string;
const has = (key: string) => i18n.exists(key, { ns: 'app' });

export const isEnglish = (): boolean => (i18n.resolvedLanguage ?? i18n.language ?? 'en').startsWith('en');

/** A statement for any failure, in the interface language. */
export function errorText(error: unknown): string {
  if (!isApiError(error)) return t('errors.generic');
  const worded = wordedFromParams(error.code, error.params);
  if (worded) return worded;
  if (isEnglish() && error.message) return error.message;
  const byCode = `errors.code.${error.code}`;
  if (has(byCode)) return t(byCode);
  const byStatus = `errors.status.${error.status}`;
  if (has(byStatus)) return t(byStatus);
  if (error.status >= 500) return t('errors.status.5xx');
  if (error.status === 0) return t('errors.code.network_error');
  return error.message || t('errors.generic');
}

/** An error the server sends as a code with parameters, worded here in every language (English too). */
function wordedFromParams(code: string, params: Record<string, string | number | boolean | null>): string | null {
  if (code === 'too_many_attempts' && typeof params.retryAfterMinutes === 'number') {
    const what = params.what === 'password-reset' ? 'passwordReset' : params.what === 'sign-in' ? 'signIn' : null;
    if (what) return t(`errors.tooManyAttempts.${what}`, { count: params.retryAfterMinutes });
  }
  return null;
}

/**
 * The known English predicates of the shared schemas and the server ("is required", "is too long"),
 * each with its key under `app:validation`. Patterns carry their numbers into the translation.
 */
const EXACT: Record<string, string> = {
  'is required': 'required',
  'is not an e-mail address': 'email',
  'is too long': 'tooLong',
  'must be an id (UUID)': 'uuid',
  'must be a number': 'number',
  'must be a whole number': 'wholeNumber',
  'must be a whole year': 'wholeYear',
  'cannot be negative': 'negative',
  'nothing to change': 'nothingToChange',
  'must not contain control characters such as line breaks': 'controlChars',
  'is not a known field': 'unknownField',
  'is not a valid link token': 'linkToken',
  'has expired or was already used': 'linkUsed',
  'is not a valid unsubscribe link': 'unsubscribeLink',
  'no longer matches an account or district': 'unsubscribeStale',
  'does not match the new password': 'passwordMismatch',
  'is on the list of common passwords; choose another': 'commonPassword',
  'is the demo password, which production refuses': 'demoPassword',
  'cannot be changed on your own account': 'ownAccount',
  'contains a district that does not exist': 'unknownDistricts',
  'is not a district': 'notADistrict',
  'must be 2–16 capital letters, digits or hyphens': 'districtCode',
  'type must be Polygon or MultiPolygon': 'geometryType',
  'must be a GeoJSON Polygon, MultiPolygon or a Feature holding one': 'geojson',
  'coordinates must be numbers': 'coordinatesNumbers',
  'a position needs longitude and latitude': 'positionLonLat',
  'longitude must be within ±180 and latitude within ±90': 'lonLatRange',
  'a linear ring needs at least four positions': 'ringFour',
  'a linear ring must end where it starts': 'ringClosed',
  'is in the future': 'future',
  'cannot be in the future': 'future',
  'must be a date (YYYY-MM-DD)': 'date',
};

const PATTERNS: { re: RegExp; key: string; values: (m: RegExpExecArray) => Record<string, string> }[] = [
  { re: /^must be at least ([\d,]+) characters$/, key: 'minChars', values: (m) => ({ n: m[1] }) },
  { re: /^must be at most ([\d,]+) characters$/, key: 'maxChars', values: (m) => ({ n: m[1] }) },
  { re: /^is too long \(([\d,]+) characters at most\)$/, key: 'maxChars', values: (m) => ({ n: m[1] }) },
  { re: /^must be one of:? /, key: 'oneOf', values: () => ({}) },
  { re: /^is not a known fields?: (.+)$/, key: 'unknownFields', values: (m) => ({ names: m[1] }) },
  { re: /^must be between (\d{4}-\d{2}-\d{2}) and (\d{4}-\d{2}-\d{2})$/, key: 'dateRange', values: (m) => ({ from: m[1], to: m[2] }) },
  { re: /^lists (.+) more than once$/, key: 'repeated', values: (m) => ({ value: m[1] }) },
  { re: /^lists too many \(([\d,]+) at most\)$/, key: 'tooMany', values: (m) => ({ n: m[1] }) },
];

/** The `app:validation` key (and values) of a known English predicate, or null. */
function validationKey(message: string): { key: string; values: Record<string, string> } | null {
  const exact = EXACT[message];
  if (exact) return { key: exact, values: {} };
  for (const p of PATTERNS) {
    const m = p.re.exec(message);
    if (m) return { key: p.key, values: p.values(m) };
  }
  return null;
}

/** A field's problem on its own (no field name), in the interface language: "is too long" → "dépasse la longueur maximale". */
export function problemText(message: string): string {
  if (isEnglish()) return message;
  const known = validationKey(message);
  return known ? t(`validation.${known.key}`, known.values) : message;
}

/**
 * A field's problem read with its label: "E-mail is not an e-mail address." in English (the schemas word
 * their messages as predicates), "Adresse e-mail : ce n'est pas une adresse e-mail valide." in French.
 * A message that is already a sentence (capitalised) is shown as it is.
 */
export function fieldErrorText(label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  const first = message.charAt(0);
  const predicate = first === first.toLowerCase() && first !== first.toUpperCase();
  if (!predicate) return /[.!?]$/.test(message) ? message : `${message}.`;
  if (isEnglish()) {
    const text = `${label} ${message}`;
    return /[.!?]$/.test(text) ? text : `${text}.`;
  }
  return t('validation.sentence', { field: label, problem: problemText(message) });
}
