import { Regions1796600500000 } from './migrations/1796600500000-Regions';

/** Reviewed migrations of districts and regions (issue 17). */
export const districtsMigrations: Function[] = [Regions1796600500000];
