import { useTranslation } from 'react-i18next';
import { SearchPicker } from '../../../components/search-picker';
import { errorText } from '../../../lib/error-text';
import { useRegionOptions } from './district-options';

/**
 * The regions a user is scoped to (issue 17): every district of a ticked region, now and as districts join
 * it, is theirs as well as the districts ticked above. Shown only when the installation has regions.
 */
export function RegionChoice({ value, onChange, error }: { value: string[]; onChange: (next: string[]) => void; error?: string }) {
  const { t } = useTranslation('users');
  const regions = useRegionOptions();
  if (regions.error) return <p className="field-hint">{t('regionsNotLoaded', { error: errorText(regions.error) })}</p>;
  if (regions.options.length === 0 && value.length === 0) return null;
  return (
    <SearchPicker
      legend={t('fields.regions')}
      hint={t('regionHint')}
      options={regions.options}
      emptyText={regions.isPending ? t('loadingRegions') : undefined}
      value={value}
      onChange={onChange}
      error={error}
    />
  );
}
