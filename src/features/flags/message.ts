import { useTranslation } from 'react-i18next';
import type { AdvisoryMessage } from '../../../shared/api/flags.schema';
import { renderMessageWith } from '../../../shared/flags/advisory-message';
import { useFormat } from '../../i18n/format';

/**
 * The client's side of renderMessage: an advisory message stored as code and numbers, worded in the
 * interface language with the `message.*` keys of the flags namespace (the same keys and words as the
 * server's mail, shared/flags/advisory-message.ts).
 */
export function useRenderMessage(): (message: AdvisoryMessage) => string {
  const { t } = useTranslation('flags');
  const { percent, date } = useFormat();
  return (message) => renderMessageWith({ t: (key, vars) => t(key, vars) as string, percent: (x) => percent(x), date: (iso) => date(iso) }, message);
}
