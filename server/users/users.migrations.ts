import { Preferences1796193003506 } from './migrations/1796193003506-Preferences';

/** Reviewed migrations of user preferences (language, units) and the bulletin's other languages (issue 9). */
export const usersMigrations: Function[] = [Preferences1796193003506];
