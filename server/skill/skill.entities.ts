import { LookBackRunEntity } from './look-back-run.entity';
import { LookBackWeekEntity } from './look-back-week.entity';

/** Tables of the Look-back (replayed seasons), apart from the live tiers. */
export const skillEntities: Function[] = [LookBackRunEntity, LookBackWeekEntity];
