import { ACTIONS, type ActionDto, type ActionId, type FlagReason } from '../../shared/api/flags.schema';
import { TIER_LABELS, tierRank, type DriverResult, type Tier } from '../../shared/tier';

export const actionsOf = (ids: readonly ActionId[]): ActionDto[] => ids.map((id) => ({ id, ...ACTIONS[id] }));

/** The actions a flag suggests: case finding when cases lead, breeding-site work when the tier rises. */
export function suggestedActions(reason: FlagReason, tier: Tier | null): ActionDto[] {
  if (reason === 'channel-above' || reason === 'case-alarm') return actionsOf(['case-finding', 'source-reduction', 'community-clean-up']);
  if (tier && tierRank(tier) >= tierRank('high')) return actionsOf(['source-reduction', 'community-clean-up', 'larval-survey', 'case-finding']);
  return actionsOf(['source-reduction', 'larval-survey']);
}

const pct = (x: number) => `${Math.round(x * 100)}%`;

/** The drivers that weigh most, in words: "Case signal (41% of the score), Climate suitability (30%)". */
export function topDrivers(drivers: DriverResult[], n = 2): string {
  const used = [...drivers].filter((d) => d.contribution > 0).sort((a, b) => b.contribution - a.contribution).slice(0, n);
  const total = drivers.reduce((a, d) => a + d.contribution, 0) || 1;
  return used.map((d, i) => `${d.label} (${pct(d.contribution / total)}${i === 0 ? ' of the score' : ''})`).join(' and ');
}

/** The advisory Broodcast proposes for a flag; the supervisor may edit it before approving. */
export function suggestedMessage(input: {
  districtName: string;
  reason: FlagReason;
  tier: Tier | null;
  previousTier: Tier | null;
  drivers: DriverResult[];
  note?: string | null;
}): string {
  const tierWords = input.tier ? `${TIER_LABELS[input.tier]}${input.previousTier && input.previousTier !== input.tier ? ` (up from ${TIER_LABELS[input.previousTier]})` : ''}` : null;
  const why: Record<FlagReason, string> = {
    'tier-rise': `Broodcast's weekly estimate for ${input.districtName} has moved up to the ${tierWords ?? 'next'} tier.`,
    'channel-above': `Reported cases in ${input.districtName} are above the usual range for this time of year (the endemic channel).`,
    'case-alarm': `Reported cases in ${input.districtName} rose faster than recent weeks would lead us to expect.`,
    manual: `Health staff have raised a concern about ${input.districtName}${input.note ? `: ${input.note}` : '.'}`,
  };
  const lines = [why[input.reason]];
  if (input.reason !== 'tier-rise' && tierWords) lines.push(`The district's risk tier is ${tierWords}.`);
  const top = topDrivers(input.drivers);
  if (top) lines.push(`What weighs most this week: ${top}.`);
  lines.push(
    'Conditions favour mosquitoes and the spread of infection. Please act on the steps below now, keep water containers covered and see a clinician early with any fever.',
    'This is an estimate to guide local action, not a forecast; follow the national health authority and its guidelines.',
  );
  return lines.join(' ');
}
