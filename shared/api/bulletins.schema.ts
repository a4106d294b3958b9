import { z } from 'zod';
import { problemReason, skippedDistrict } from './problems.schema';
import { language } from './auth.schema';
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
/**
 * What an unsubscribe link stops and whether it still receives it. `scope` 'district': every mail for
 * `districtName` (the link in an advisory); 'bulletin': the weekly bulletin for every district (the link in
 * the digest; advisories go on). `language` is the reader's, so the page speaks it before any sign-in.
 */
export const unsubscribeResponse = z.object({
  email: z.string(),
  districtName: z.string().nullable(),
  scope: z.enum(['district', 'bulletin']),
  language: language,
  subscribed: z.boolean(),
});
export type UnsubscribeResponse = z.infer<typeof unsubscribeResponse>;

/** `language`: preview the bulletin as a reader of that language gets it (default: English). */
export const bulletinQuery = z.strictObject({ districtId: uuid, language: language.optional() });
export const bulletinPreviewQuery = z.strictObject({ districtId: uuid.optional(), language: language.optional() });
/** The signed-in person's own weekly digest, as they would get it (in their language unless `language` says). */
export const digestPreviewQuery = z.strictObject({ language: language.optional() });

export const digestPreviewResponse = z.object({
  epiYear: z.number().int(),
  epiWeek: z.number().int(),
  language: language,
  layout: z.enum(['detail', 'overview']),
  subject: z.string(),
  text: z.string(),
  filename: z.string(),
  districts: z.number().int(),
});
export type DigestPreviewResponse = z.infer<typeof digestPreviewResponse>;

/** One reader whose weekly digest could not be written, and why; every other reader's was. */
export const skippedRecipient = z.object({ userId: z.string(), email: z.string(), reason: problemReason });

export const bulletinPreviewResponse = z.object({
  districtId: uuid,
  districtName: z.string(),
  epiYear: z.number().int().nullable(),
  epiWeek: z.number().int().nullable(),
  language: language,
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
  /** One digest per person and week: how many were written now (messagesQueued counts their mails). */
  digestsWritten: z.number().int(),
  /** Readers whose digest could not be written, with why; every other reader's was queued. */
  recipientsFailed: z.array(skippedRecipient),
});
export type BulletinSendResponse = z.infer<typeof bulletinSendResponse>;

export const OUTBOX_STATUSES = ['pending', 'sent', 'failed'] as const;
export const outboxQuery = z.strictObject({
  status: z.enum([...OUTBOX_STATUSES, 'all']).default('all'),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

export const outboxMessageDto = z.object({
  id: uuid,
  kind: z.enum(['advisory', 'bulletin', 'invite', 'password-reset', 'field-week']),
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
