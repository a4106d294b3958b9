import { ACTIONS, type ActionDto, type ActionId, type FlagReason } from '../../shared/api/flags.schema';
import { LANGUAGES } from '../../shared/api/auth.schema';
import { tierRank, type DriverResult, type Tier } from '../../shared/tier';
import { DEFAULT_LANGUAGE, formatFor, textsFor, type Language } from '../i18n';

/**
 * The actions as stored with a flag and an advisory: id, and the English title and text (the API's
 * words). Mails and bulletins show them in the reader's language by id (advisory.mails.ts actionIn).
 */
export const actionsOf = (ids: readonly ActionId[]): ActionDto[] => ids.map((id) => ({ id, ...ACTIONS[id] }));

/** The actions a flag suggests: case finding when cases lead, breeding-site work when the tier rises. */
export function suggestedActions(reason: FlagReason, tier: Tier | null): ActionDto[] {
  if (reason === 'channel-above' || reason === 'case-alarm') return actionsOf(['case-finding', 'source-reduction', 'community-clean-up']);
  if (tier && tierRank(tier) >= tierRank('high')) return actionsOf(['source-reduction', 'community-clean-up', 'larval-survey', 'case-finding']);
  return actionsOf(['source-reduction', 'larval-survey']);
}

/** The drivers that weigh most, in words: "Case signal (41% of the score) and Climate suitability (30%)". */
export function topDrivers(drivers: Pick<DriverResult, 'id' | 'contribution'>[], n = 2, language: Language = DEFAULT_LANGUAGE): string {
  const t = textsFor(language, 'flags');
  const c = textsFor(language, 'common');
  const f = formatFor(language);
  const used = [...drivers].filter((d) => d.contribution > 0).sort((a, b) => b.contribution - a.contribution).slice(0, n);
  const total = drivers.reduce((a, d) => a + d.contribution, 0) || 1;
  return used
    .map((d, i) => t(i === 0 ? 'driverFirst' : 'driverOther', { driver: c(`drivers.${d.id}`), share: f.percent(d.contribution / total) }))
    .join(t('and'));
}

const WHY_KEY: Record<FlagReason, string> = { 'tier-rise': 'why.tierRise', 'channel-above': 'why.channelAbove', 'case-alarm': 'why.caseAlarm', manual: 'why.manual' };

export interface SuggestionInput {
  districtName: string;
  reason: FlagReason;
  tier: Tier | null;
  previousTier: Tier | null;
  drivers: Pick<DriverResult, 'id' | 'contribution'>[];
  note?: string | null;
  /** The language to write in; English by default (the season run writes its flags in it). */
  language?: Language;
}

/** The advisory Broodcast proposes for a flag; the supervisor may edit it before approving. */
export function suggestedMessage(input: SuggestionInput): string {
  const language = input.language ?? DEFAULT_LANGUAGE;
  const t = textsFor(language, 'flags');
  const c = textsFor(language, 'common');
  const tierWords = input.tier
    ? input.previousTier && input.previousTier !== input.tier
      ? t('tierUp', { tier: c(`tiers.${input.tier}`), previous: c(`tiers.${input.previousTier}`) })
      : c(`tiers.${input.tier}`)
    : null;
  const district = input.districtName;
  let why: string;
  if (input.reason === 'tier-rise') why = tierWords ? t('why.tierRise', { district, tier: tierWords }) : t('why.tierRiseNext', { district });
  else if (input.reason === 'manual') why = input.note ? t('why.manualNote', { district, note: input.note }) : t('why.manual', { district });
  else why = t(WHY_KEY[input.reason], { district });
  const lines = [why];
  if (input.reason !== 'tier-rise' && tierWords) lines.push(t('tierIs', { tier: tierWords }));
  const top = topDrivers(input.drivers, 2, language);
  if (top) lines.push(t('weighsMost', { drivers: top }));
  lines.push(t('act'), t('estimate'));
  return lines.join(' ');
}

/**
 * The advisory's message for one reader. A message the supervisor approved as Broodcast suggested it
 * (in any of the languages) is written again in the reader's language from the flag's own facts; a
 * message a person wrote or edited is sent exactly as approved.
 */
export function messageFor(language: Language, approved: string, flag: Omit<SuggestionInput, 'language'> | null): string {
  if (!flag) return approved;
  const generated = LANGUAGES.some((l) => suggestedMessage({ ...flag, language: l }) === approved);
  return generated ? suggestedMessage({ ...flag, language }) : approved;
}
