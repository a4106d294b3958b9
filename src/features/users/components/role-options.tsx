import { DISTRICT_SCOPED_ROLES, ROLE_LABELS, ROLES, type Role } from '../../../../shared/roles';

export function RoleOptions({ placeholder }: { placeholder?: string }) {
  return (
    <>
      {placeholder ? <option value="">{placeholder}</option> : null}
      {ROLES.map((r) => (
        <option key={r} value={r}>
          {ROLE_LABELS[r]}
        </option>
      ))}
    </>
  );
}

/** Explains what the district choice means for the chosen role. */
export function districtHint(role: Role | '' | undefined): string {
  if (role && DISTRICT_SCOPED_ROLES.includes(role)) {
    return `A ${ROLE_LABELS[role].toLowerCase()} sees and works only in the districts ticked here.`;
  }
  const scoped = DISTRICT_SCOPED_ROLES.map((r) => ROLE_LABELS[r].toLowerCase() + 's').join(' and ');
  return `The districts limit what ${scoped} see. Other roles see every district; ticked districts set their bulletins.`;
}
