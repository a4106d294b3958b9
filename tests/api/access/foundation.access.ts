import { ALL_SIGNED_IN, EVERYBODY, type AccessTable } from './who';

export const foundationAccess: AccessTable = {
  'GET /health': EVERYBODY,
  'POST /auth/sign-in': EVERYBODY,
  'GET /me': ALL_SIGNED_IN,
  'POST /auth/password-reset': EVERYBODY,
  'POST /auth/password-reset/confirm': EVERYBODY,
  'POST /auth/invite/accept': EVERYBODY,
  'GET /users': ['admin'],
  'POST /users': ['admin'],
  'PATCH /users/:id': ['admin'],
  'PATCH /me/preferences': ALL_SIGNED_IN,
  'GET /districts': ALL_SIGNED_IN,
  'GET /districts/boundaries': ALL_SIGNED_IN,
  'GET /districts/:id': ALL_SIGNED_IN,
  'POST /districts': ['admin'],
  'PATCH /districts/:id': ['admin'],
  'PUT /districts/:id/populations': ['admin'],
  'PUT /districts/:id/boundary': ['admin'],
  // The API's OpenAPI document (issue 15): admins.
  'GET /openapi.json': ['admin'],
};

export const signOutAccess: AccessTable = { 'POST /auth/sign-out': EVERYBODY };
