import { SeasonRun1796165195155 } from './migrations/1796165195155-SeasonRun';

/** Reviewed migrations of the season run and tiers. */
export const seasonMigrations: Function[] = [SeasonRun1796165195155];
