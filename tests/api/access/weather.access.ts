import type { AccessTable } from './who';

/** Routes of the weather feature and who may call them. */
export const weatherAccess: AccessTable = {};
