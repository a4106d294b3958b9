import { ALL_SIGNED_IN, type AccessTable } from './who';

/** Routes of the cases feature and who may call them (docs/product.md § Roles; docs/case-ledger.md). */
export const casesAccess: AccessTable = {
  'GET /diseases': ALL_SIGNED_IN,
  'POST /diseases': ['admin'],
  'GET /cases/settings': ALL_SIGNED_IN,
  'GET /cases/grid': ALL_SIGNED_IN,
  'POST /cases/uploads': ['epidemiologist'],
  'GET /cases/counts/:id/revisions': ['admin', 'supervisor', 'epidemiologist'],
  'GET /districts/:id/cases': ALL_SIGNED_IN,
  'GET /districts/:id/cases/count': ALL_SIGNED_IN,
  'PUT /districts/:id/cases': ['epidemiologist'],
  'POST /districts/:id/weeks/close': ['epidemiologist', 'supervisor'],
  'POST /districts/:id/weeks/reopen': ['epidemiologist', 'supervisor'],
  'PUT /districts/:id/channel-settings': ['admin', 'epidemiologist'],
  'POST /surveys': ['officer', 'worker'],
  'POST /surveys/:id/void': ['officer', 'worker'],
  'POST /cases/counts/:id/void': ['epidemiologist'],
  'GET /districts/:id/surveys': ALL_SIGNED_IN,
};
