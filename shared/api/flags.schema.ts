import { z } from 'zod';
import { DRIVERS, TIERS } from '../tier/tier-settings';
import { driverDto } from './board.schema';
import { uniqueArray, uuid } from './common.schema';

/** Why a flag was raised. The season run raises the first three; people raise the last. */
export const FLAG_REASONS = ['tier-rise', 'channel-above', 'case-alarm', 'manual'] as const;
export type FlagReason = (typeof FLAG_REASONS)[number];
export const FLAG_REASON_LABELS: Record<FlagReason, string> = {
  'tier-rise': 'Tier went up',
  'channel-above': 'Cases above the endemic channel',
  'case-alarm': 'Case alarm (C2 test)',
  manual: 'Raised by hand',
};

/**
 * `lapsed`: an open flag older than the flag settings allow (computed on read; stored once another flag
 * of its district and reason is raised). It has left the sign-off queue and may no longer be approved.
 */
export const FLAG_STATUSES = ['open', 'lapsed', 'approved', 'rejected'] as const;
export type FlagStatus = (typeof FLAG_STATUSES)[number];
export const FLAG_STATUS_LABELS: Record<FlagStatus, string> = { open: 'Waiting for sign-off', lapsed: 'Lapsed', approved: 'Approved', rejected: 'Rejected' };

/**
 * The wording an advisory message is composed with, chosen from the numbers (shared/flags/advisory-message.ts):
 * the vector in diapause, zero climate suitability, no signal at all, the case signal alone, or the group
 * of drivers that carries most of the score; `custom` is a message a person wrote.
 */
export const MESSAGE_CODES = ['diapause', 'zero-suitability', 'no-signal', 'case-signal-only', 'case-led', 'weather-led', 'larval-led', 'mixed', 'custom'] as const;
export type MessageCode = (typeof MESSAGE_CODES)[number];

/**
 * The actions a flag may suggest, in Broodcast's own words. Each is general public-health practice for
 * mosquito-borne disease; none names a product or a dose, and every one carries ACTION_CAUTION.
 */
export const ACTION_IDS = ['source-reduction', 'community-clean-up', 'larval-survey', 'case-finding'] as const;
export type ActionId = (typeof ACTION_IDS)[number];
export const ACTIONS: Record<ActionId, { title: string; text: string }> = {
  'source-reduction': {
    title: 'Remove breeding water',
    text: 'Go round homes, schools and markets and get rid of standing water where mosquitoes lay eggs: cover water jars and tanks, empty and turn over buckets, tyres and pots, and clear blocked drains and gutters. Do it again every week while the tier stays up.',
  },
  'community-clean-up': {
    title: 'Hold a neighbourhood clean-up',
    text: 'Plan a clean-up day with local leaders and volunteers to collect rubbish that traps rainwater (tins, plastic, old tyres), and tell households in plain words why it matters and what they can do at home.',
  },
  'larval-survey': {
    title: 'Survey for larvae this week',
    text: 'Ask community workers to inspect houses and containers in the worst-affected areas and record what they find in Broodcast, so the larval indices show where breeding is heaviest.',
  },
  'case-finding': {
    title: 'Look actively for cases',
    text: 'Ask clinics and community workers to watch for people with fever, send them to a clinician for assessment and testing, and report weekly counts on time to the district epidemiologist.',
  },
};
/** Said with every suggested action, wherever it is shown or sent. */
export const ACTION_CAUTION =
  'Any use of larvicides, insecticides or fogging is work for trained staff only, following local regulations and the product label.';

export const actionDto = z.object({ id: z.enum(ACTION_IDS), title: z.string(), text: z.string() });
export type ActionDto = z.infer<typeof actionDto>;

const person = z.object({ id: uuid, displayName: z.string() }).nullable();
const tier = z.enum(TIERS);

/** The numbers a message is worded from; stored with the flag and the advisory (JSON), never sentences. */
export const messageParams = z.object({
  district: z.string(),
  reason: z.enum(FLAG_REASONS),
  tier: tier.nullable(),
  previousTier: tier.nullable(),
  /** The week of the tier the message speaks of. */
  epiYear: z.number().int().nullable(),
  epiWeek: z.number().int().nullable(),
  /** The drivers that weigh most, with their share of the score (shared/tier/driver-shares.ts). */
  shares: z.array(z.object({ id: z.enum(DRIVERS), share: z.number() })),
  /** The flag's own date, week and tier, when the message speaks of a newer tier (a superseded flag). */
  flag: z.object({ raisedOn: z.string(), epiYear: z.number().int().nullable(), epiWeek: z.number().int().nullable(), tier: tier.nullable() }).optional(),
  /** A custom message's words. */
  text: z.string().optional(),
});
export type MessageParams = z.infer<typeof messageParams>;
export const advisoryMessage = z.object({ code: z.enum(MESSAGE_CODES), params: messageParams });
export type AdvisoryMessage = z.infer<typeof advisoryMessage>;

/** The district's tier now (its newest season run), shown beside the tier that raised a flag. */
export const currentTierDto = z.object({
  tier: tier,
  epiYear: z.number().int(),
  epiWeek: z.number().int(),
  computedAt: z.string(),
  drivers: z.array(driverDto),
});

export const flagDto = z.object({
  id: uuid,
  districtId: uuid,
  districtCode: z.string(),
  districtName: z.string(),
  reason: z.enum(FLAG_REASONS),
  source: z.enum(['season-run', 'manual']),
  status: z.enum(FLAG_STATUSES),
  tier: tier.nullable(),
  previousTier: tier.nullable(),
  epiYear: z.number().int().nullable(),
  epiWeek: z.number().int().nullable(),
  drivers: z.array(driverDto),
  /** The suggested message as stored, in English (the sign-off screen words `message` in the reader's language). */
  suggestedMessage: z.string(),
  /** The suggested message as a code and its numbers. */
  message: advisoryMessage,
  /** What approving it unedited would send now: for a superseded flag, worded from the current tier, with the flag's date. */
  proposal: advisoryMessage,
  actions: z.array(actionDto),
  caution: z.string(),
  /** A hand-raised flag's internal note: what the person saw. Never public (not in the message, the advisory or a mail). */
  note: z.string().nullable(),
  /** A hand-raised flag's public message, as its author wrote it (null: Broodcast composed one from the numbers). */
  publicMessage: z.string().nullable(),
  /** The district's tier now; null when it has none. */
  current: currentTierDto.nullable(),
  /** A newer season run has computed the district's tier since the flag was raised (approving it speaks of the current tier). */
  superseded: z.boolean(),
  /** When an open flag leaves the queue as lapsed (flag settings). */
  lapsesAt: z.string().nullable(),
  raisedBy: person,
  createdAt: z.string(),
  decidedBy: person,
  decidedAt: z.string().nullable(),
  decisionReason: z.string().nullable(),
  finalMessage: z.string().nullable(),
  /** The approved message as code and numbers (its advisory's), to word it in the reader's language. */
  finalComposed: advisoryMessage.nullable(),
  advisoryId: uuid.nullable(),
  version: z.number().int(),
});
export type FlagDto = z.infer<typeof flagDto>;

export const flagHistoryEntry = z.object({
  at: z.string(),
  action: z.string(),
  actor: person,
  reason: z.string().nullable(),
  before: z.unknown(),
  after: z.unknown(),
});
export type FlagHistoryEntry = z.infer<typeof flagHistoryEntry>;

export const flagsResponse = z.object({ flags: z.array(flagDto), lapseWeeks: z.number().int() });
export const flagDetailResponse = z.object({ flag: flagDto, history: z.array(flagHistoryEntry) });
export type FlagDetailResponse = z.infer<typeof flagDetailResponse>;

export const flagsQuery = z.strictObject({
  status: z.enum([...FLAG_STATUSES, 'all']).default('open'),
  districtId: uuid.optional(),
});

const message = z.string().trim().min(10, { message: 'must be at least 10 characters' }).max(2000, { message: 'must be at most 2,000 characters' });
const version = z.number().int().min(1).optional();

export const raiseFlagBody = z.strictObject({
  districtId: uuid,
  /** Why the flag is raised: what the person saw. An internal note for the supervisor; never sent to the public. */
  note: z.string().trim().min(3, { message: 'must say why (3 characters or more)' }).max(1000),
  /** The public message proposed for the advisory; Broodcast composes one from the tier and drivers when left out. */
  message: message.optional(),
  actions: uniqueArray(z.enum(ACTION_IDS), { max: ACTION_IDS.length }).min(1, { message: 'choose at least one action' }).optional(),
});
export type RaiseFlagBody = z.infer<typeof raiseFlagBody>;

export const approveFlagBody = z.strictObject({
  /** The advisory text, edited by the supervisor; the suggested message when left out. */
  message: message.optional(),
  /** The version the supervisor saw; a flag changed since then is refused with 409. */
  version,
});
export type ApproveFlagBody = z.infer<typeof approveFlagBody>;

export const rejectFlagBody = z.strictObject({
  reason: z.string().trim().min(3, { message: 'must say why (3 characters or more)' }).max(500),
  version,
});
export type RejectFlagBody = z.infer<typeof rejectFlagBody>;

export const advisoryDto = z.object({
  id: uuid,
  flagId: uuid,
  districtId: uuid,
  districtCode: z.string(),
  districtName: z.string(),
  tier: tier.nullable(),
  /** The message in English (or as a person wrote it); `composed` words it in the reader's language. */
  message: z.string(),
  /** The message as a code and its numbers; null for advisories issued before messages were composed. */
  composed: advisoryMessage.nullable(),
  actions: z.array(actionDto),
  caution: z.string(),
  issuedBy: person,
  issuedAt: z.string(),
  expiresAt: z.string(),
  current: z.boolean(),
  recipients: z.number().int(),
});
export type AdvisoryDto = z.infer<typeof advisoryDto>;
export const advisoriesResponse = z.object({ advisories: z.array(advisoryDto) });
export const advisoriesQuery = z.strictObject({ districtId: uuid.optional() });

/** How long an open flag waits for sign-off before it lapses (admin; every change audited with its reason). */
export const flagSettingsDto = z.object({
  lapseWeeks: z.number().int(),
  updatedAt: z.string().nullable(),
  updatedBy: person,
});
export type FlagSettingsDto = z.infer<typeof flagSettingsDto>;
export const DEFAULT_LAPSE_WEEKS = 2;
export const flagSettingsBody = z.strictObject({
  lapseWeeks: z.number().int({ message: 'must be a whole number of weeks' }).min(1, { message: 'must be 1 or more' }).max(26, { message: 'must be 26 or less' }),
  reason: z.string().trim().min(3, { message: 'must say why (3 characters or more)' }).max(500),
});
export type FlagSettingsBody = z.infer<typeof flagSettingsBody>;
