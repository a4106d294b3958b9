import { z } from 'zod';
import { skippedDistrict } from './problems.schema';
import { uniqueArray, uuid } from './common.schema';

/** What a subscription delivers: advisories as they are approved, and the weekly bulletin. */
export const MAIL_KINDS = ['advisory', 'bulletin'] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

export const subscriptionDto = z.object({
  districtId: uuid,
  districtCode: z.string(),
  districtName: z.string(),
  advisory: z.boolean(),
  bulletin: z.boolean(),
});
export type SubscriptionDto = z.infer<typeof subscriptionDto>;

export const subscriptionsResponse = z.object({
  /** 'default': the role's default applies (nothing chosen yet); 'chosen': the person's own choice. */
  source: z.enum(['default', 'chosen']),
  email: z.string(),
  districts: z.array(subscriptionDto),
});
export type SubscriptionsResponse = z.infer<typeof subscriptionsResponse>;

export const subscriptionsBody = z.strictObject({
  districts: uniqueArray(z.strictObject({ districtId: uuid, advisory: z.boolean(), bulletin: z.boolean() }), {
    max: 5000,
    key: (d) => d.districtId,
  }),
});
export type SubscriptionsBody = z.infer<typeof subscriptionsBody>;

export const unsubscribeParams = z.strictObject({ token: z.string().min(10).max(2000) });
export const unsubscribeResponse = z.object({ districtName: z.string(), email: z.string() });

export const bulletinQuery = z.strictObject({ districtId: uuid });
export const bulletinPreviewQuery = z.strictObject({ districtId: uuid.optional() });

export const bulletinPreviewResponse = z.object({
  districtId: uuid,
  districtName: z.string(),
  epiYear: z.number().int().nullable(),
  epiWeek: z.number().int().nullable(),
  subject: z.string(),
  text: z.string(),
  recipients: z.number().int(),
  /** Whether this week's bulletin for the district has already been written and queued. */
  alreadySent: z.boolean(),
});
export type BulletinPreviewResponse = z.infer<typeof bulletinPreviewResponse>;

export const bulletinSendResponse = z.object({
  epiYear: z.number().int().nullable(),
  epiWeek: z.number().int().nullable(),
  bulletinsWritten: z.number().int(),
  districtsSkipped: z.number().int(),
  messagesQueued: z.number().int(),
  /** Districts whose bulletin could not be written (their data failed), with why; the others were sent. */
  districtsFailed: z.array(skippedDistrict),
});
export type BulletinSendResponse = z.infer<typeof bulletinSendResponse>;

export const OUTBOX_STATUSES = ['pending', 'sent', 'failed'] as const;
export const outboxQuery = z.strictObject({
  status: z.enum([...OUTBOX_STATUSES, 'all']).default('all'),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

export const outboxMessageDto = z.object({
  id: uuid,
  kind: z.enum(['advisory', 'bulletin', 'invite', 'password-reset']),
  to: z.string(),
  subject: z.string(),
  status: z.enum(OUTBOX_STATUSES),
  attempts: z.number().int(),
  nextAttemptAt: z.string().nullable(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
  log: z.array(z.object({ at: z.string(), outcome: z.enum(['sent', 'retry', 'failed']), error: z.string().nullable(), durationMs: z.number().int() })),
});
export type OutboxMessageDto = z.infer<typeof outboxMessageDto>;
export const outboxResponse = z.object({
  counts: z.object({ pending: z.number().int(), sent: z.number().int(), failed: z.number().int() }),
  messages: z.array(outboxMessageDto),
});
export type OutboxResponse = z.infer<typeof outboxResponse>;
