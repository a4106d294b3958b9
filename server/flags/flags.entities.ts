import { AdvisoryEntity } from '../advisories/advisory.entity';
import { BulletinDigestEntity } from '../bulletins/bulletin-digest.entity';
import { BulletinEntity } from '../bulletins/bulletin.entity';
import { BulletinTranslationEntity } from '../bulletins/bulletin-translation.entity';
import { SubscriptionEntity } from '../bulletins/subscription.entity';
import { OutboxAttemptEntity } from '../outbox/outbox-attempt.entity';
import { OutboxMessageEntity } from '../outbox/outbox-message.entity';
import { FlagEntity } from './flag.entity';
import { FlagSettingsEntity } from './flag-settings.entity';

/** Flags, sign-off, advisories, subscriptions, bulletins and the mail outbox (issue 7). */
export const flagsEntities: Function[] = [
  FlagEntity,
  FlagSettingsEntity,
  AdvisoryEntity,
  SubscriptionEntity,
  BulletinEntity,
  BulletinTranslationEntity,
  BulletinDigestEntity,
  OutboxMessageEntity,
  OutboxAttemptEntity,
];
