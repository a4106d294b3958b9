import { ALL_SIGNED_IN, type AccessTable } from './who';

/** The profile library and its assignment to districts. */
export const profilesAccess: AccessTable = {
  'GET /profiles': ALL_SIGNED_IN,
  'PUT /districts/profiles': ['admin'],
  'POST /profiles/:id/variants': ['admin'],
};
