import { ProfileVariants1796300000000 } from './migrations/1796300000000-ProfileVariants';

/** Reviewed migrations of the profile library and its assignment. */
export const profilesMigrations: Function[] = [ProfileVariants1796300000000];
