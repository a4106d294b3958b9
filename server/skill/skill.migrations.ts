import { LookBack1796600700000 } from './migrations/1796600700000-LookBack';

/** Reviewed migrations of the Look-back. */
export const skillMigrations: Function[] = [LookBack1796600700000];
