import { ALL_SIGNED_IN, type AccessTable } from './who';

/** Season runs, tier settings, the board and the District file. */
export const seasonAccess: AccessTable = {
  'GET /season-runs': ['admin', 'officer'],
  'POST /season-runs': ['admin', 'officer'],
  'GET /season-runs/:id': ['admin', 'officer'],
  'GET /tier-settings': ALL_SIGNED_IN,
  'PUT /tier-settings': ['admin'],
  'POST /tier-settings/preview': ['admin'],
  'GET /board': ALL_SIGNED_IN,
  'GET /districts/:id/file': ALL_SIGNED_IN,
  'GET /districts/:id/outlook': ALL_SIGNED_IN,
};
