import { useMemo } from 'react';
import type { CheckboxOption } from '../../../components/form';
import { useTranslation } from 'react-i18next';
import { useDistricts } from '../../districts/api/districts.api';
import { useRegions } from '../../districts/api/regions.api';

/** The districts an admin can assign, as checkbox options ("HV-03 — Orrin Valley"). */
export function useDistrictOptions(): { options: CheckboxOption[]; isPending: boolean; error: Error | null } {
  const districts = useDistricts();
  const options = useMemo(
    () =>
      [...(districts.data ?? [])]
        .sort((a, b) => a.code.localeCompare(b.code))
        .map((d) => ({ value: d.id, label: `${d.code} — ${d.name}` })),
    [districts.data],
  );
  return { options, isPending: districts.isPending, error: districts.error };
}

/** The regions an admin can scope a user to, as checkbox options ("FL — Florida (67 districts)"). */
export function useRegionOptions(): { options: CheckboxOption[]; isPending: boolean; error: Error | null } {
  const { t } = useTranslation('users');
  const regions = useRegions();
  const options = useMemo(
    () =>
      [...(regions.data ?? [])]
        .sort((a, b) => a.name.localeCompare(b.name))
        .map((r) => ({ value: r.id, label: t('regionOption', { code: r.code, name: r.name, count: r.districtCount }) })),
    [regions.data, t],
  );
  return { options, isPending: regions.isPending, error: regions.error };
}
