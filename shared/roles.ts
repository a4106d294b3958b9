/** The five roles of docs/product.md § Roles. The ids are stored in the database; the labels are shown. */
export const ROLES = ['admin', 'officer', 'epidemiologist', 'supervisor', 'worker'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  officer: 'Health officer',
  epidemiologist: 'Epidemiologist',
  supervisor: 'Supervisor',
  worker: 'Community worker',
};

/** Roles whose view is limited to the districts assigned to them. */
export const DISTRICT_SCOPED_ROLES: readonly Role[] = ['epidemiologist', 'worker'];

// Who may do what: the permission table in shared/permissions.ts (the Look-back's rows are lookBack.*).
