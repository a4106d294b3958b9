import { FlagsAndBulletins1796166213030 } from './migrations/1796166213030-FlagsAndBulletins';
import { FlagsStayCurrent1796600200000 } from './migrations/1796600200000-FlagsStayCurrent';
import { BulletinDigests1796600400000 } from './migrations/1796600400000-BulletinDigests';

/** Reviewed migrations of flags, advisories, subscriptions, bulletins and the outbox. */
export const flagsMigrations: Function[] = [FlagsAndBulletins1796166213030, FlagsStayCurrent1796600200000, BulletinDigests1796600400000];
