import { FlagsAndBulletins1796166213030 } from './migrations/1796166213030-FlagsAndBulletins';

/** Reviewed migrations of flags, advisories, subscriptions, bulletins and the outbox. */
export const flagsMigrations: Function[] = [FlagsAndBulletins1796166213030];
