/**
 * Skill scores: how well a warning (a tier at or above a level, or a continuous score) issued for a
 * district-week told of an event k weeks later. Pure functions, no I/O (docs/skill.md).
 *
 * Definitions: Wilks 2011, "Statistical Methods in the Atmospheric Sciences", 3rd ed., ch. 8
 * (2×2 contingency table: hits a, false alarms b, misses c, correct negatives d; hit rate a/(a+c),
 * false-alarm ratio b/(a+b), false-alarm rate b/(b+d), Brier score); Jolliffe & Stephenson 2012,
 * "Forecast Verification", 2nd ed., ch. 3; Hanley & McNeil 1982, Radiology 143:29–36 (the area under
 * the ROC curve equals the Mann–Whitney U statistic divided by n₁·n₀, ties counted half).
 */
import { seededRandom } from '../stats/random';

export { seededRandom };

/** One district-week: the warning score issued that week and whether an event happened that week. */
export interface ScoredWeek {
  district: string;
  /** Season id: the unit the bootstrap resamples. */
  season: string;
  /** Week index inside the season, 0-based and consecutive. */
  week: number;
  /** Warning score issued that week: a tier rank (0 baseline … 3 critical) or a continuous score. */
  score: number;
  /** Event in this week; null when it cannot be decided (too few other seasons for a channel). */
  event: boolean | null;
}

/** A warning paired with the outcome `lead` weeks later in the same district and season. */
export interface ScoredPair {
  district: string;
  season: string;
  week: number;
  score: number;
  event: boolean;
}

export interface Contingency {
  hits: number;
  falseAlarms: number;
  misses: number;
  correctNegatives: number;
}

const key = (district: string, season: string, week: number) => `${district}\u0000${season}\u0000${week}`;

/**
 * Pairs each week's warning with the event `lead` weeks later in the same district and season. Pairs
 * whose outcome week is missing or undecided are dropped. A lead of 0 pairs a week with itself.
 */
export function pairAtLead(weeks: readonly ScoredWeek[], lead: number): ScoredPair[] {
  if (!Number.isInteger(lead) || lead < 0) throw new RangeError(`lead must be a whole number ≥ 0, got ${lead}`);
  const byKey = new Map(weeks.map((w) => [key(w.district, w.season, w.week), w]));
  const pairs: ScoredPair[] = [];
  for (const w of weeks) {
    const later = byKey.get(key(w.district, w.season, w.week + lead));
    if (later === undefined || later.event === null) continue;
    pairs.push({ district: w.district, season: w.season, week: w.week, score: w.score, event: later.event });
  }
  return pairs;
}

/** The 2×2 table of warnings (score ≥ threshold) against events. */
export function contingency(pairs: readonly ScoredPair[], threshold: number): Contingency {
  const t: Contingency = { hits: 0, falseAlarms: 0, misses: 0, correctNegatives: 0 };
  for (const p of pairs) {
    const warned = p.score >= threshold;
    if (warned && p.event) t.hits += 1;
    else if (warned) t.falseAlarms += 1;
    else if (p.event) t.misses += 1;
    else t.correctNegatives += 1;
  }
  return t;
}

const ratio = (num: number, den: number): number | null => (den === 0 ? null : num / den);

/** Hit rate (probability of detection) a/(a+c); null when there was no event. Wilks 2011 eq. 8.12. */
export const hitRate = (t: Contingency) => ratio(t.hits, t.hits + t.misses);
/** False-alarm ratio b/(a+b): share of warnings not followed by an event. Wilks 2011 eq. 8.13. */
export const falseAlarmRatio = (t: Contingency) => ratio(t.falseAlarms, t.hits + t.falseAlarms);
/** False-alarm rate (probability of false detection) b/(b+d). Wilks 2011 eq. 8.14. */
export const falseAlarmRate = (t: Contingency) => ratio(t.falseAlarms, t.falseAlarms + t.correctNegatives);

/**
 * Area under the ROC curve in its Mann–Whitney form (Hanley & McNeil 1982): the share of
 * (event, non-event) pairs in which the event week had the higher score, ties counting one half.
 * Null when either class is empty. Computed from mid-ranks, O(n log n).
 */
export function rocAuc(pairs: readonly ScoredPair[]): number | null {
  const n1 = pairs.filter((p) => p.event).length;
  const n0 = pairs.length - n1;
  if (n1 === 0 || n0 === 0) return null;
  const sorted = [...pairs].sort((x, y) => x.score - y.score);
  let rankSumEvents = 0;
  for (let i = 0; i < sorted.length; ) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1]!.score === sorted[i]!.score) j += 1;
    const midRank = (i + j) / 2 + 1; // ranks are 1-based; ties share the mean rank
    for (let k = i; k <= j; k += 1) if (sorted[k]!.event) rankSumEvents += midRank;
    i = j + 1;
  }
  const u = rankSumEvents - (n1 * (n1 + 1)) / 2;
  return u / (n1 * n0);
}

/**
 * Calibration by event frequency per score value: each distinct score (a tier) is given the
 * probability of the observed event frequency among the pairs with that score. In-sample: it is
 * the best a fixed mapping of tiers to probabilities could do on these weeks, so it flatters.
 */
export function calibrateByFrequency(pairs: readonly ScoredPair[]): Map<number, number> {
  const counts = new Map<number, { n: number; events: number }>();
  for (const p of pairs) {
    const c = counts.get(p.score) ?? { n: 0, events: 0 };
    c.n += 1;
    if (p.event) c.events += 1;
    counts.set(p.score, c);
  }
  return new Map([...counts].map(([s, c]) => [s, c.events / c.n]));
}

/**
 * Brier score (Wilks 2011 eq. 8.36): mean of (p − o)², p the probability from `calibrateByFrequency`
 * (or the score itself when `scoresAreProbabilities`), o 1 for an event and 0 otherwise. Null when empty.
 */
export function brierScore(pairs: readonly ScoredPair[], scoresAreProbabilities = false): number | null {
  if (pairs.length === 0) return null;
  const calibration = scoresAreProbabilities ? null : calibrateByFrequency(pairs);
  let sum = 0;
  for (const p of pairs) {
    const prob = calibration ? calibration.get(p.score)! : p.score;
    if (prob < 0 || prob > 1) throw new RangeError(`probability must lie in [0, 1], got ${prob}`);
    sum += (prob - (p.event ? 1 : 0)) ** 2;
  }
  return sum / pairs.length;
}

/**
 * Lead time before each event onset (an event week whose previous week in the same district and
 * season was not an event, or the first week): the number of weeks in the unbroken run of warnings
 * (score ≥ threshold) ending the week before the onset, capped at `maxLead`. 0 = not warned ahead.
 */
export function leadTimes(weeks: readonly ScoredWeek[], threshold: number, maxLead = 12): number[] {
  const byKey = new Map(weeks.map((w) => [key(w.district, w.season, w.week), w]));
  const leads: number[] = [];
  for (const w of weeks) {
    if (w.event !== true) continue;
    if (byKey.get(key(w.district, w.season, w.week - 1))?.event === true) continue;
    let lead = 0;
    while (lead < maxLead) {
      const before = byKey.get(key(w.district, w.season, w.week - lead - 1));
      if (before === undefined || before.score < threshold) break;
      lead += 1;
    }
    leads.push(lead);
  }
  return leads;
}

export interface BootstrapInterval {
  estimate: number | null;
  lower: number | null;
  upper: number | null;
  /** Replicates in which the statistic could be computed. */
  replicates: number;
}

export interface BootstrapOptions {
  replicates?: number;
  /** Two-sided level of the percentile interval (default 0.9). */
  level?: number;
  seed?: number;
}

/**
 * Percentile bootstrap interval resampling whole seasons with replacement (Efron & Tibshirani 1993,
 * "An Introduction to the Bootstrap", ch. 13): weeks of one season stay together, so the
 * dependence between neighbouring weeks is kept. Replicates where the statistic is null are skipped.
 */
export function bootstrapBySeason<T extends { season: string }>(
  items: readonly T[],
  statistic: (sample: readonly T[]) => number | null,
  options: BootstrapOptions = {},
): BootstrapInterval {
  const { replicates = 500, level = 0.9, seed = 1 } = options;
  const estimate = statistic(items);
  const seasons = new Map<string, T[]>();
  for (const it of items) seasons.set(it.season, [...(seasons.get(it.season) ?? []), it]);
  const groups = [...seasons.values()];
  if (groups.length === 0) return { estimate, lower: null, upper: null, replicates: 0 };
  const random = seededRandom(seed);
  const values: number[] = [];
  for (let r = 0; r < replicates; r += 1) {
    const sample: T[] = [];
    for (let g = 0; g < groups.length; g += 1) sample.push(...groups[Math.floor(random() * groups.length)]!);
    const v = statistic(sample);
    if (v !== null && Number.isFinite(v)) values.push(v);
  }
  if (values.length === 0) return { estimate, lower: null, upper: null, replicates: 0 };
  values.sort((x, y) => x - y);
  const at = (q: number) => values[Math.min(values.length - 1, Math.max(0, Math.floor(q * values.length)))]!;
  return { estimate, lower: at((1 - level) / 2), upper: at(1 - (1 - level) / 2), replicates: values.length };
}
