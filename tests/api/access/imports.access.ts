import { ALL_SIGNED_IN, type AccessTable } from './who';

/** Regions and the imports of districts, stations and populations (issue 17; docs/product.md § Roles: admin imports). */
export const importsAccess: AccessTable = {
  'GET /regions': ALL_SIGNED_IN,
  'POST /districts/import': ['admin'],
  'POST /districts/populations/import': ['admin'],
  'POST /weather/stations/import': ['admin'],
  'GET /demo': ['admin'],
  'POST /demo/remove': ['admin'],
};
