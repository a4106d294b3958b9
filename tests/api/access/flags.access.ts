import { ALL_SIGNED_IN, EVERYBODY, type AccessTable } from './who';

/** Flags, sign-off, advisories, bulletins, subscriptions and the mail delivery log (issue 7). */
export const flagsAccess: AccessTable = {
  'GET /flags': ['admin', 'officer', 'epidemiologist', 'supervisor'],
  'POST /flags': ['officer', 'epidemiologist'],
  'GET /flags/:id': ['admin', 'officer', 'epidemiologist', 'supervisor'],
  'POST /flags/:id/approve': ['supervisor'],
  'POST /flags/:id/reject': ['supervisor'],
  'GET /flag-settings': ['admin'],
  'PUT /flag-settings': ['admin'],
  'GET /advisories': ALL_SIGNED_IN,
  'GET /bulletins/preview': ['supervisor'],
  'GET /bulletins/preview/html': ['supervisor'],
  'GET /bulletins/preview/pdf': ['supervisor'],
  'GET /bulletins/digest/preview': ALL_SIGNED_IN,
  'GET /bulletins/digest/preview/html': ALL_SIGNED_IN,
  'GET /bulletins/digest/preview/pdf': ALL_SIGNED_IN,
  'POST /bulletins/send': ['admin', 'supervisor'],
  'GET /subscriptions/me': ALL_SIGNED_IN,
  'PUT /subscriptions/me': ALL_SIGNED_IN,
  'GET /unsubscribe/:token': EVERYBODY,
  'POST /unsubscribe/:token': EVERYBODY,
  'POST /unsubscribe/:token/undo': EVERYBODY,
  'GET /outbox': ['admin', 'supervisor'],
};
