/**
 * The skill report: for each lead time, the tier's scores per district and overall, with the three
 * null models scored on the same weeks (docs/skill.md). Pure: the caller supplies the replayed tiers
 * and the case counts.
 */
import { channelAloneModel, climatologyModel, eventWeeks, persistenceModel, type EventDefinition, type SeasonCounts } from './events';
import {
  bootstrapBySeason,
  brierScore,
  contingency,
  falseAlarmRate,
  falseAlarmRatio,
  hitRate,
  leadTimes,
  pairAtLead,
  rocAuc,
  type BootstrapInterval,
  type Contingency,
  type ScoredWeek,
} from './scores';

export interface DistrictSkillInput {
  district: string;
  /** Case counts per season, week by week, in season order (oldest first). */
  seasons: readonly SeasonCounts[];
  /** Replayed tier rank (0 baseline … 3 critical) per season, aligned with `seasons[i].counts`; null = not replayed. */
  tierRanks: ReadonlyMap<string, readonly (number | null)[]>;
}

export interface ModelScores {
  table: Contingency;
  hitRate: number | null;
  falseAlarmRatio: number | null;
  falseAlarmRate: number | null;
  auc: number | null;
  /** Brier score with the event frequency per score value as the probability (in-sample calibration). */
  brier: number | null;
  hitRateInterval: BootstrapInterval;
  falseAlarmRatioInterval: BootstrapInterval;
  /** Interval of the ROC area: one that includes 0.5 shows no skill at telling event weeks from quiet ones. */
  aucInterval: BootstrapInterval;
  falseAlarmRateInterval: BootstrapInterval;
}

export interface LeadSkill {
  lead: number;
  pairs: number;
  tier: ModelScores;
  climatology: ModelScores;
  persistence: ModelScores;
  channel: ModelScores;
}

export interface SkillReport {
  level: number;
  overall: LeadSkill[];
  districts: { district: string; leads: LeadSkill[]; leadTimes: number[] }[];
  /** Lead time (weeks of unbroken warning before each onset) over all districts. */
  leadTimes: number[];
}

/** Warning rules of the null models: the majority climatology, the event last week, the count above the channel. */
export const NULL_THRESHOLDS = { climatology: 0.5, persistence: 1, channel: 1 } as const;

function scoresOf(weeks: readonly ScoredWeek[], lead: number, threshold: number, bootstrap: { replicates: number; seed: number }): ModelScores {
  const pairs = pairAtLead(weeks, lead);
  const table = contingency(pairs, threshold);
  return {
    table,
    hitRate: hitRate(table),
    falseAlarmRatio: falseAlarmRatio(table),
    falseAlarmRate: falseAlarmRate(table),
    auc: rocAuc(pairs),
    brier: brierScore(pairs),
    hitRateInterval: bootstrapBySeason(pairs, (p) => hitRate(contingency(p, threshold)), bootstrap),
    falseAlarmRatioInterval: bootstrapBySeason(pairs, (p) => falseAlarmRatio(contingency(p, threshold)), bootstrap),
    aucInterval: bootstrapBySeason(pairs, rocAuc, bootstrap),
    falseAlarmRateInterval: bootstrapBySeason(pairs, (p) => falseAlarmRate(contingency(p, threshold)), bootstrap),
  };
}

function leadSkill(
  models: { tier: ScoredWeek[]; climatology: ScoredWeek[]; persistence: ScoredWeek[]; channel: ScoredWeek[] },
  lead: number,
  level: number,
  bootstrap: { replicates: number; seed: number },
): LeadSkill {
  return {
    lead,
    pairs: pairAtLead(models.tier, lead).length,
    tier: scoresOf(models.tier, lead, level, bootstrap),
    climatology: scoresOf(models.climatology, lead, NULL_THRESHOLDS.climatology, bootstrap),
    persistence: scoresOf(models.persistence, lead, NULL_THRESHOLDS.persistence, bootstrap),
    channel: scoresOf(models.channel, lead, NULL_THRESHOLDS.channel, bootstrap),
  };
}

/**
 * Scores the replayed tier (warning: rank ≥ `level`) against events `lead` weeks later for each lead,
 * per district and over all districts, with the null models on the same weeks. Weeks without a
 * replayed tier are left out of every model, so all four are scored on the same weeks.
 */
export function skillReport(
  inputs: readonly DistrictSkillInput[],
  options: { leads: readonly number[]; level: number; event: EventDefinition; replicates?: number; seed?: number },
): SkillReport {
  const bootstrap = { replicates: options.replicates ?? 300, seed: options.seed ?? 1 };
  const all = { tier: [] as ScoredWeek[], climatology: [] as ScoredWeek[], persistence: [] as ScoredWeek[], channel: [] as ScoredWeek[] };
  const districts: SkillReport['districts'] = [];
  for (const d of inputs) {
    const events = eventWeeks(d.seasons, options.event);
    const every: ScoredWeek[] = d.seasons.flatMap((s) =>
      s.counts.map((_, week) => ({ district: d.district, season: s.season, week, score: d.tierRanks.get(s.season)?.[week] ?? Number.NaN, event: events.get(s.season)?.[week] ?? null })),
    );
    const replayed = (ws: ScoredWeek[]) => ws.filter((_, i) => !Number.isNaN(every[i]!.score));
    const models = {
      tier: replayed(every),
      climatology: replayed(climatologyModel(every)),
      persistence: replayed(persistenceModel(every)),
      channel: replayed(channelAloneModel(d.district, d.seasons, options.event, every)),
    };
    for (const k of Object.keys(all) as (keyof typeof all)[]) all[k].push(...models[k]);
    districts.push({
      district: d.district,
      leads: options.leads.map((lead) => leadSkill(models, lead, options.level, bootstrap)),
      leadTimes: leadTimes(models.tier, options.level),
    });
  }
  return {
    level: options.level,
    overall: options.leads.map((lead) => leadSkill(all, lead, options.level, bootstrap)),
    districts,
    leadTimes: districts.flatMap((d) => d.leadTimes),
  };
}
