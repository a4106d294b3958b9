import { SeasonRun1796165312435 } from './migrations/1796165312435-SeasonRun';
import { VectorClockSeasons1796192751564 } from './migrations/1796192751564-VectorClockSeasons';
import { TierComputedAtIndex1796194567806 } from './migrations/1796194567806-TierComputedAtIndex';
import { TierCasesWeek1796600300000 } from './migrations/1796600300000-TierCasesWeek';
import { SeasonRunWarningsTotal1796601700000 } from './migrations/1796601700000-SeasonRunWarningsTotal';

/** Reviewed migrations of the season run and tiers. */
export const seasonMigrations: Function[] = [SeasonRun1796165312435, VectorClockSeasons1796192751564, TierComputedAtIndex1796194567806, TierCasesWeek1796600300000, SeasonRunWarningsTotal1796601700000];
