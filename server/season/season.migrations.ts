import { SeasonRun1796165312435 } from './migrations/1796165312435-SeasonRun';

/** Reviewed migrations of the season run and tiers. */
export const seasonMigrations: Function[] = [SeasonRun1796165312435];
