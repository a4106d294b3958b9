import type { AccessTable } from './who';

/** The Look-back (issue 18): epidemiologists and admins start one; officers and supervisors read too. */
export const lookBackAccess: AccessTable = {
  'GET /look-back/runs': ['admin', 'epidemiologist', 'officer', 'supervisor'],
  'POST /look-back/runs': ['admin', 'epidemiologist', 'officer'],
  'GET /look-back/runs/:id': ['admin', 'epidemiologist', 'officer', 'supervisor'],
  'GET /look-back/runs/:id/scores': ['admin', 'epidemiologist', 'officer', 'supervisor'],
};
