import { i18n } from '../i18n';
import type { ProblemReason } from '../../shared/api/problems.schema';

/**
 * Why a district, message or row failed inside a region-wide job, in the interface language: the
 * server sends a code with parameters (shared/api/problems.schema.ts); an unknown code is named as a code,
 * never shown as raw JSON.
 */
export function problemReasonText(reason: ProblemReason | undefined): string {
  if (!reason) return i18n.t('problems.reason.unknown', { ns: 'app' }) as string;
  const key = `problems.reason.${reason.code}`;
  if (i18n.exists(key, { ns: 'app' })) return i18n.t(key, { ns: 'app', ...(reason.params ?? {}) }) as string;
  return i18n.t('problems.reason.other', { ns: 'app', code: reason.code }) as string;
}
