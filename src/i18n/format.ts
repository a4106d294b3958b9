import { useTranslation } from 'react-i18next';
import { formattersFor, type Formatters } from '../../shared/locale-format';

export { formattersFor, type Formatters } from '../../shared/locale-format';

/** The formatters of the current interface language (re-renders when it changes). */
export function useFormat(): Formatters {
  const { i18n } = useTranslation();
  return formattersFor(i18n.language);
}
