import { useMemo } from 'react';
import type { CheckboxOption } from '../../../components/form';
import { useDistricts } from '../../districts/api/districts.api';

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
