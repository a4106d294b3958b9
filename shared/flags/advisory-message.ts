/**
 * Advisory messages composed from the numbers (issue 16 item 4). A flag or an advisory stores a message
 * CODE and its PARAMS, never English sentences; each side words them in the reader's language with the
 * same keys (`message.*` of the `flags` namespace, identical in server/i18n/locales and src/i18n/locales;
 * tests/unit/advisory-message.test.ts checks both). Pure: no I/O, no i18n library.
 */
import type { AdvisoryMessage, MessageCode, MessageParams } from '../api/flags.schema';
import { driverShares } from '../tier/driver-shares';
import type { DriverId, Tier } from '../tier/tier-settings';

/** What a message is composed from: the flag's reason and the tier (with its drivers) it speaks of. */
export interface ComposeInput {
  district: string;
  reason: MessageParams['reason'];
  tier: Tier | null;
  previousTier: Tier | null;
  epiYear: number | null;
  epiWeek: number | null;
  drivers: readonly { id: string; score?: number | null; contribution: number; detail?: Record<string, unknown> | null }[];
  /** Set when the message speaks of a newer tier than the flag's own (a superseded flag): the flag's date and tier. */
  flag?: MessageParams['flag'];
}

/**
 * A group of drivers leads when it carries at least this share of the tier score (a majority; Broodcast's
 * own choice, documented in docs/flags-and-bulletins.md). Below it in every group the message is "mixed".
 */
export const LEAD_SHARE = 0.5;

const contributionOf = (drivers: ComposeInput['drivers'], ids: DriverId[]) =>
  drivers.filter((d) => (ids as string[]).includes(d.id)).reduce((a, d) => a + Math.max(0, d.contribution), 0);

/** Which wording the numbers call for, most specific first. */
export function messageCodeOf(drivers: ComposeInput['drivers']): Exclude<MessageCode, 'custom'> {
  const climate = drivers.find((d) => d.id === 'climate');
  // The profile's season window is shut (day length and temperature keep the vector in diapause).
  if (climate?.detail?.seasonOpen === false) return 'diapause';
  if (climate && climate.score === 0) return 'zero-suitability';
  const total = drivers.reduce((a, d) => a + Math.max(0, d.contribution), 0);
  if (!(total > 0)) return 'no-signal';
  const cases = contributionOf(drivers, ['cases']);
  if (cases > 0 && cases >= total) return 'case-signal-only';
  const weather = contributionOf(drivers, ['climate', 'vectorClock']) / total;
  const larval = contributionOf(drivers, ['larval']) / total;
  if (weather >= LEAD_SHARE) return 'weather-led';
  if (larval >= LEAD_SHARE) return 'larval-led';
  if (cases / total >= LEAD_SHARE) return 'case-led';
  return 'mixed';
}

/** The message Broodcast proposes for a flag, as a code and the numbers it is worded from. */
export function composeMessage(input: ComposeInput): AdvisoryMessage {
  return {
    code: messageCodeOf(input.drivers),
    params: {
      district: input.district,
      reason: input.reason,
      tier: input.tier,
      previousTier: input.previousTier,
      epiYear: input.epiYear,
      epiWeek: input.epiWeek,
      shares: driverShares(input.drivers).slice(0, 2).map(({ id, share }) => ({ id, share })),
      ...(input.flag ? { flag: input.flag } : {}),
    },
  };
}

/** A message a person wrote, kept as their words (with the flag's date when it speaks of a newer tier). */
export const customMessage = (text: string, params: Omit<MessageParams, 'shares' | 'text'> & { shares?: MessageParams['shares'] }): AdvisoryMessage => ({
  code: 'custom',
  params: { ...params, shares: params.shares ?? [], text },
});

/** The translate function and formatters of one language, from either side's i18n. */
export interface MessageWords {
  /** Translates a key of the `flags` namespace (`message.…`). */
  t: (key: string, vars?: Record<string, unknown>) => string;
  percent: (share: number) => string;
  date: (iso: string) => string;
}

const SITUATION: Record<Exclude<MessageCode, 'custom'>, string> = {
  diapause: 'diapause',
  'zero-suitability': 'zeroSuitability',
  'no-signal': 'noSignal',
  'case-signal-only': 'caseSignalOnly',
  'case-led': 'caseLed',
  'weather-led': 'weatherLed',
  'larval-led': 'larvalLed',
  mixed: 'mixed',
};

/** What to do, by what the numbers say: no "conditions favour mosquitoes" where they do not. */
function adviceKey(code: Exclude<MessageCode, 'custom'>, hasCases: boolean): string {
  switch (code) {
    case 'diapause':
    case 'zero-suitability':
      return hasCases ? 'quietCases' : 'quiet';
    case 'no-signal':
      return 'watch';
    case 'case-signal-only':
    case 'case-led':
      return 'cases';
    default:
      return 'act';
  }
}

/**
 * The message in one language. The sentences: why (the flag's reason), the tier, what the numbers say
 * (by code), what weighs most (the shares from driverShares), what to do, the flag's date when the message
 * speaks of a newer tier, and that this is an estimate. A custom message is the person's words, with the
 * flag's date when it applies.
 */
export function renderMessageWith(w: MessageWords, message: AdvisoryMessage): string {
  const { code, params: p } = message;
  const tierWord = (x: Tier) => w.t(`message.tiers.${x}`);
  const flagDate = p.flag
    ? p.flag.epiWeek !== null && p.flag.epiYear !== null && p.epiWeek !== null && p.epiYear !== null
      ? w.t('message.flagDate', {
          date: w.date(p.flag.raisedOn), week: p.flag.epiWeek, year: p.flag.epiYear, nowWeek: p.epiWeek, nowYear: p.epiYear,
          tier: p.flag.tier ? tierWord(p.flag.tier) : w.t('message.noTier'),
        })
      : w.t('message.flagDateShort', { date: w.date(p.flag.raisedOn) })
    : null;
  if (code === 'custom') return [p.text ?? '', flagDate].filter(Boolean).join(' ');

  const tierWords = p.tier
    ? p.previousTier && p.previousTier !== p.tier
      ? w.t('message.tierUp', { tier: tierWord(p.tier), previous: tierWord(p.previousTier) })
      : tierWord(p.tier)
    : null;
  const district = p.district;
  const lines: string[] = [];
  // Speaking of a newer tier than the flag's (superseded): say where the district stands now, not why the flag was raised then.
  if (p.flag) lines.push(tierWords ? w.t('message.why.current', { district, tier: tierWords }) : w.t('message.why.currentNoTier', { district }));
  else if (p.reason === 'tier-rise') lines.push(tierWords ? w.t('message.why.tierRise', { district, tier: tierWords }) : w.t('message.why.tierRiseNext', { district }));
  else lines.push(w.t(`message.why.${p.reason === 'channel-above' ? 'channelAbove' : p.reason === 'case-alarm' ? 'caseAlarm' : 'manual'}`, { district }));
  if (!p.flag && p.reason !== 'tier-rise' && tierWords) lines.push(w.t('message.tierIs', { tier: tierWords }));
  lines.push(w.t(`message.situation.${SITUATION[code]}`));
  // "What weighs most" only where something does: at the Baseline tier, in diapause, with zero
  // suitability or no signal, the largest share of a near-zero score points at nothing (a Baseline district
  // with no cases read "Case signal (100 % of the score)").
  const nothingWeighs = p.tier === 'baseline' || code === 'diapause' || code === 'zero-suitability' || code === 'no-signal';
  if (p.shares.length && !nothingWeighs) {
    const list = p.shares
      .map((s, i) => w.t(i === 0 ? 'message.driverFirst' : 'message.driverOther', { driver: w.t(`message.drivers.${s.id}`), share: w.percent(s.share) }))
      .join(w.t('message.and'));
    lines.push(w.t('message.weighsMost', { drivers: list }));
  }
  lines.push(w.t(`message.advice.${adviceKey(code, p.shares.some((s) => s.id === 'cases'))}`));
  if (flagDate) lines.push(flagDate);
  lines.push(w.t('message.estimate'));
  return lines.join(' ');
}
