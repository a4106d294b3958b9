import type { AccessTable } from './who';

/** Routes of the cases feature and who may call them. */
export const casesAccess: AccessTable = {};
