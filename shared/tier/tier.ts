/**
 * The tier: a weighted, documented combination of four drivers (docs/tier.md), each scored 0–1.
 * Pure; the season run stores the result and its drivers, and every screen explains a tier by them.
 */
import { DRIVER_LABELS, DRIVERS, type DriverId, type Tier, type TierSettings, TIERS } from './tier-settings';

export interface ClimateInput {
  /** Mean relative vectorial capacity over the last 14 days (0–1, 1 = the profile's optimum). */
  rvc14: number | null;
  seasonOpen: boolean | null;
}
export interface VectorClockInput {
  /** Share of the EIP a mosquito infected today completes within its expected life (capped at 1). */
  eipShare: number | null;
  /** Generations completed this season ÷ the usual number by this date in prior seasons. */
  generationsRatio: number | null;
}
export interface LarvalInput {
  breteau: number | null;
  house: number | null;
}
export interface CaseInput {
  zone: 'below' | 'within' | 'above' | null;
  aberrationAlarm: boolean | null;
  /** Week-on-week ratio of counts (this week ÷ last week). */
  growthRatio: number | null;
  cases: number | null;
}

export interface TierInputs {
  climate: ClimateInput;
  vectorClock: VectorClockInput;
  larval: LarvalInput;
  cases: CaseInput;
  /** Days since the newest weather day used, and weeks since the newest case count. */
  weatherAgeDays: number | null;
  caseAgeWeeks: number | null;
}

export interface DriverResult {
  id: DriverId;
  label: string;
  /** 0–1, or null when the data behind it is missing (its weight is then shared among the others). */
  score: number | null;
  weight: number;
  /** The driver's share of the final score (score × weight ÷ sum of the weights in use). */
  contribution: number;
  /** The data behind it, as shown on the District file. */
  detail: Record<string, number | boolean | string | null>;
}

export interface TierResult {
  score: number;
  tier: Tier;
  drivers: DriverResult[];
  /** 'ok'; 'stale' when weather or counts are older than the settings allow; 'insufficient' when no driver has data. */
  confidence: 'ok' | 'stale' | 'insufficient';
  notes: string[];
  leadingDriver: DriverId | null;
}

const clamp01 = (x: number) => Math.min(1, Math.max(0, x));

function climateScore(c: ClimateInput): number | null {
  if (c.seasonOpen === false) return 0;
  return c.rvc14 === null ? null : clamp01(c.rvc14);
}

/** Half EIP completion, half generations against the usual (twice the usual scores 1). */
function vectorClockScore(v: VectorClockInput): number | null {
  const parts: number[] = [];
  if (v.eipShare !== null) parts.push(clamp01(v.eipShare));
  if (v.generationsRatio !== null) parts.push(clamp01(v.generationsRatio / 2));
  return parts.length ? parts.reduce((a, b) => a + b, 0) / parts.length : null;
}

function larvalScore(l: LarvalInput, s: TierSettings): number | null {
  return l.breteau === null ? null : clamp01(l.breteau / s.breteauFull);
}

/** Channel zone sets the base (below 0, within 0.5, above 1); an aberration alarm and growth add. */
function caseScore(c: CaseInput): number | null {
  if (c.zone === null && c.aberrationAlarm === null) return null;
  const zone = c.zone === 'above' ? 1 : c.zone === 'within' ? 0.5 : 0;
  const alarm = c.aberrationAlarm ? 1 : 0;
  const growth = c.growthRatio === null ? 0 : clamp01(c.growthRatio - 1);
  return clamp01(0.6 * zone + 0.25 * alarm + 0.15 * growth);
}

export function tierOf(score: number, s: TierSettings): Tier {
  if (score >= s.cuts.critical) return 'critical';
  if (score >= s.cuts.high) return 'high';
  if (score >= s.cuts.raised) return 'raised';
  return 'baseline';
}

export function computeTier(inputs: TierInputs, s: TierSettings): TierResult {
  const scores: Record<DriverId, number | null> = {
    climate: climateScore(inputs.climate),
    vectorClock: vectorClockScore(inputs.vectorClock),
    larval: larvalScore(inputs.larval, s),
    cases: caseScore(inputs.cases),
  };
  const details: Record<DriverId, DriverResult['detail']> = {
    climate: { ...inputs.climate },
    vectorClock: { ...inputs.vectorClock },
    larval: { ...inputs.larval },
    cases: { ...inputs.cases },
  };
  const used = DRIVERS.filter((d) => scores[d] !== null && s.weights[d] > 0);
  const weightSum = used.reduce((a, d) => a + s.weights[d], 0);
  const drivers: DriverResult[] = DRIVERS.map((id) => ({
    id,
    label: DRIVER_LABELS[id],
    score: scores[id] === null ? null : round(scores[id]!),
    weight: s.weights[id],
    contribution: used.includes(id) && weightSum > 0 ? round((scores[id]! * s.weights[id]) / weightSum) : 0,
    detail: details[id],
  }));
  const score = round(drivers.reduce((a, d) => a + d.contribution, 0));
  const notes: string[] = [];
  let confidence: TierResult['confidence'] = 'ok';
  if (used.length === 0) {
    confidence = 'insufficient';
    notes.push('No driver has data yet: the tier cannot be estimated.');
  }
  for (const d of DRIVERS) if (scores[d] === null) notes.push(`${DRIVER_LABELS[d]}: no data; its weight is shared among the others.`);
  if (inputs.weatherAgeDays === null || inputs.weatherAgeDays > s.staleWeatherDays) {
    if (confidence === 'ok') confidence = 'stale';
    notes.push(inputs.weatherAgeDays === null ? 'No weather for this district.' : `The newest weather is ${inputs.weatherAgeDays} days old.`);
  }
  if (inputs.caseAgeWeeks !== null && inputs.caseAgeWeeks > s.staleCaseWeeks) {
    if (confidence === 'ok') confidence = 'stale';
    notes.push(`The newest case count is ${inputs.caseAgeWeeks} weeks old.`);
  }
  const leading = [...drivers].sort((a, b) => b.contribution - a.contribution)[0];
  return {
    score,
    tier: tierOf(score, s),
    drivers,
    confidence,
    notes,
    leadingDriver: leading && leading.contribution > 0 ? leading.id : null,
  };
}

/** Which driver moved the score most since last week (for "what changed it"). */
export function changedDriver(now: DriverResult[], before: DriverResult[] | null): DriverId | null {
  if (!before) return null;
  let best: DriverId | null = null;
  let delta = 0;
  for (const d of now) {
    const prev = before.find((b) => b.id === d.id)?.contribution ?? 0;
    if (Math.abs(d.contribution - prev) > Math.abs(delta)) {
      delta = d.contribution - prev;
      best = d.id;
    }
  }
  return Math.abs(delta) >= 0.005 ? best : null;
}

export const tierRank = (t: Tier) => TIERS.indexOf(t);
const round = (x: number) => Math.round(x * 10_000) / 10_000;
