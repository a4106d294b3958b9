import type { AccessTable } from './who';

/** The Field log (issue 19): team members and health officers record work; everybody signed in reads (district-scoped). */
export const fieldRecordsAccess: AccessTable = {
  'POST /field-records': ['officer', 'worker'],
  'GET /field-records': ['admin', 'officer', 'epidemiologist', 'supervisor', 'worker'],
  'GET /districts/:id/field-work': ['admin', 'officer', 'epidemiologist', 'supervisor', 'worker'],
};
