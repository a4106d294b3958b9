import { ALL_SIGNED_IN, type AccessTable } from './who';

const EDITORS: AccessTable[string] = ['admin', 'officer'];

/** Routes of the weather feature and who may call them (docs/product.md § Roles: upload or correct weather, manage stations). */
export const weatherAccess: AccessTable = {
  'GET /weather/stations': ALL_SIGNED_IN,
  'POST /weather/stations': EDITORS,
  'PATCH /weather/stations/:id': EDITORS,
  'GET /weather/stations/:id/days': ALL_SIGNED_IN,
  'GET /weather/stations/:id/revisions': EDITORS,
  'POST /weather/uploads': EDITORS,
  'GET /weather/uploads': EDITORS,
  'GET /weather/uploads/:id': EDITORS,
  'GET /weather/uploads/:id/issues': EDITORS,
  'PUT /weather/observations': EDITORS,
  'POST /weather/observations/void': EDITORS,
  'POST /weather/observations/confirm': EDITORS,
  'GET /weather/held': EDITORS,
  'GET /weather/conflicts': EDITORS,
  'POST /weather/conflicts/:id/resolve': EDITORS,
  'POST /weather/feed/pull': EDITORS,
  'GET /weather/districts/:id/series': ALL_SIGNED_IN,
};
