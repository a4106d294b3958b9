import type { Config } from '../server/config';
import { BulletinsService } from '../server/bulletins/bulletins.service';
import type { JobDef } from './job';

/** The weekly bulletin (BULLETIN_CRON in TIMEZONE). The service takes the lock itself, as "send now" shares it. */
export const bulletinJob = (config: Config): JobDef => ({
  name: 'bulletin',
  cron: config.BULLETIN_CRON || null,
  timezone: config.TIMEZONE,
  lock: false,
  run: (ctx) => new BulletinsService(ctx).sendLocked(),
});
