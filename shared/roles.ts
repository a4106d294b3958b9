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

/**
 * Who may use the Look-back (replayed past seasons and their scores, docs/skill.md): admins, health
 * officers and epidemiologists start one; supervisors read them too (docs/product.md § Roles). The routes, the menu and the route ×
 * role test all read this.
 */
export const LOOK_BACK_ROLES = {
  start: ['admin', 'officer', 'epidemiologist'],
  read: ['admin', 'epidemiologist', 'officer', 'supervisor'],
} as const satisfies Record<string, readonly Role[]>;
