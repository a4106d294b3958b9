import type { TFunction } from 'i18next';

/** Today's date on this device, YYYY-MM-DD (en-CA formats that way; a machine format, not shown as is). */
export const localToday = () => new Date().toLocaleDateString('en-CA');

/** A new survey id. crypto.randomUUID needs a secure context; the fallback builds the same layout from getRandomValues. */
export function newSurveyId(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6] & 0x0f) | 0x40;
  b[8] = (b[8] & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

/** A larval index with one decimal in the interface's number format ('—' when it cannot be computed). */
export const formatIndex = (
  number: (x: number | null | undefined, digits?: number, fixed?: boolean) => string,
  value: number | null,
  t?: TFunction<'surveys'>,
) => (value === null ? '—' : t ? t('index.percent', { value: number(value, 1, true) }) : number(value, 1, true));

/**
 * The survey schema's messages (shared/api/surveys.schema.ts, shared/signals/schemas.ts) in the
 * interface language, as whole sentences naming the field; an unknown message is shown as it is.
 */
const KNOWN: Record<string, string> = {
  'is required': 'required',
  'is too long': 'tooLong',
  'must be a number': 'number',
  'must be a whole number': 'wholeNumber',
  'cannot be negative': 'negative',
  'is implausibly large': 'tooLarge',
  'must be a date (YYYY-MM-DD)': 'date',
  'cannot be in the future': 'future',
  'must be an id (UUID)': 'id',
  'is not a known container type': 'containerType',
  'positive houses exceed houses inspected': 'housesExceed',
  'positive containers exceed containers inspected': 'containersExceed',
  'each positive house needs at least one positive container': 'houseWithoutContainer',
  'positive containers but no positive house': 'containerWithoutHouse',
  'pupae found but no positive house': 'pupaeWithoutHouse',
};

export function surveyMessage(t: TFunction<'surveys'>, label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  const key = KNOWN[message];
  if (key) return t(`validation.${key}`, { field: label });
  const range = /^must be between (\d{4}-\d{2}-\d{2}) and (\d{4}-\d{2}-\d{2})$/.exec(message);
  return range ? t('validation.dateRange', { field: label, from: range[1], to: range[2] }) : message;
}

/** A form field's label for a path the server names ("body.housesPositive" → "Houses with larvae or pupae"). */
export const FIELD_LABEL_KEYS: Record<string, string> = {
  districtId: 'form.district',
  locality: 'form.locality',
  date: 'form.date',
  housesInspected: 'form.housesInspected',
  housesPositive: 'form.housesPositive',
  containersInspected: 'form.containersInspected',
  containersPositive: 'form.containersPositive',
  pupae: 'form.pupae',
  containerTypes: 'form.containerTypes',
  notes: 'form.notes',
};
