import type { TFunction } from 'i18next';
import type { Formatters } from '../../i18n/format';

/** The reasons the server gives for refusing a weather file as a whole (or failing on its side). */
const KNOWN = new Set([
  'binary_file', 'bad_header', 'empty_file', 'no_rows', 'truncated_file', 'bad_csv', 'line_too_long', 'file_refused', 'intake_error', 'server_stopped',
]);

/**
 * Why a weather upload was refused or failed, in the interface language, from the server's stable code
 * and its parameters; `detail` is the server's own English sentence, shown under it in other languages
 * (it names the columns or the parser's words). Null when the code is not one of the known reasons.
 */
export function refusalText(
  code: string | null | undefined,
  params: Record<string, unknown> | null | undefined,
  message: string | null | undefined,
  t: TFunction<'weather'>,
  f: Formatters,
  language: string,
): { text: string; detail: string | null } | null {
  if (!code || !KNOWN.has(code)) return null;
  const line = typeof params?.line === 'number' ? f.number(params.line) : '?';
  const limit = typeof params?.limitBytes === 'number' ? `${f.number(params.limitBytes / 1024)} kB` : '';
  const text = t(`refusal.${code}`, { line, limit });
  const english = language.startsWith('en');
  // In English the server's sentence is the more specific one (it names the columns); elsewhere it is shown as detail.
  if (english && message) return { text: message, detail: null };
  return { text, detail: !english && message ? t('refusal.serverDetail', { message }) : null };
}
