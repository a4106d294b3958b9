import { useTranslation } from 'react-i18next';
import { DISTRICT_SCOPED_ROLES, ROLES, type Role } from '../../../../shared/roles';
import { useRoleLabel } from '../../../lib/labels';

export function RoleOptions({ placeholder }: { placeholder?: string }) {
  const roleLabel = useRoleLabel();
  return (
    <>
      {placeholder ? <option value="">{placeholder}</option> : null}
      {ROLES.map((r) => (
        <option key={r} value={r}>
          {roleLabel(r)}
        </option>
      ))}
    </>
  );
}

/** Explains what the district choice means for the chosen role. */
export function useDistrictHint(role: Role | '' | undefined): string {
  const { t } = useTranslation('users');
  if (role && DISTRICT_SCOPED_ROLES.includes(role)) return t(`districtHint.scoped.${role}`);
  return t('districtHint.others');
}
