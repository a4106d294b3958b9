import type { AccessTable } from './who';

/** Routes of the Field week (issue 19) and who may call them (docs/product.md § Roles: the officer plans; teams see theirs). */
export const fieldAccess: AccessTable = {
  'GET /field-teams': ['officer', 'supervisor', 'worker'],
  'GET /field-teams/candidates': ['officer'],
  'POST /field-teams': ['officer'],
  'PUT /field-teams/:id': ['officer'],
  'POST /field-teams/:id/retire': ['officer'],
  'DELETE /field-teams/:id': ['officer'],
  'GET /field-weeks': ['officer', 'supervisor', 'worker'],
  'POST /field-weeks/proposal': ['officer'],
  'PUT /field-weeks/:id/days': ['officer'],
  'POST /field-weeks/:id/publish': ['officer'],
  'GET /field-weeks/awaiting': ['supervisor'],
  'POST /field-weeks/:id/approve': ['supervisor'],
  'POST /field-weeks/:id/send-back': ['supervisor'],
  'GET /field-settings': ['admin'],
  'PUT /field-settings': ['admin'],
};
