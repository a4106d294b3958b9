import { mean, quantileType7, sampleSd } from './descriptive';
import {
  channelHistorySchema,
  channelMethodSchema,
  confidenceLevelSchema,
  type ChannelMethod,
  type ChannelZoneId,
} from './schemas';
import { studentTTwoSided } from './student-t';

/** The endemic channel for one week: lower bound, centre line, upper bound, all ≥ 0. */
export interface ChannelBand {
  lower: number;
  centre: number;
  upper: number;
}

export interface ChannelOptions {
  /** Two-sided confidence level of the geometric band (default 0.95). Ignored by other methods. */
  level?: number;
}

const floorAtZero = (x: number): number => (x > 0 ? x : 0);

/**
 * Geometric channel after Bortman 1999, "Elaboración de corredores o canales endémicos mediante
 * planillas de cálculo", Rev. Panam. Salud Pública 5(1):1–8: y = ln(x + 1); centre = e^ȳ − 1;
 * band e^(ȳ ± t·s/√n) − 1, t the two-sided Student quantile on n − 1 df, s the sample SD of y.
 */
function geometricChannel(history: readonly number[], level: number): ChannelBand {
  const y = history.map((x) => Math.log1p(x));
  const n = y.length;
  const yBar = mean(y);
  const halfWidth = (studentTTwoSided(n - 1, level) * sampleSd(y)) / Math.sqrt(n);
  return {
    lower: floorAtZero(Math.expm1(yBar - halfWidth)),
    centre: floorAtZero(Math.expm1(yBar)),
    upper: floorAtZero(Math.expm1(yBar + halfWidth)),
  };
}

/** Quartile channel: Q1, median, Q3 by Hyndman & Fan (1996) definition 7. */
function quartileChannel(history: readonly number[]): ChannelBand {
  return {
    lower: quantileType7(history, 0.25),
    centre: quantileType7(history, 0.5),
    upper: quantileType7(history, 0.75),
  };
}

/** Mean ± 2 sample SD of the same week in prior seasons; lower bound floored at zero. */
function meanTwoSdChannel(history: readonly number[]): ChannelBand {
  const m = mean(history);
  const sd = sampleSd(history);
  return { lower: floorAtZero(m - 2 * sd), centre: m, upper: m + 2 * sd };
}

/**
 * The endemic channel for one week from the counts (or rates) of the same week in each prior season.
 * The caller leaves out epidemic seasons before calling. Throws a ZodError on invalid input.
 */
export function endemicChannel(
  method: ChannelMethod,
  history: readonly number[],
  options: ChannelOptions = {},
): ChannelBand {
  const m = channelMethodSchema.parse(method);
  const h = channelHistorySchema.parse(history);
  switch (m) {
    case 'geometric':
      return geometricChannel(h, confidenceLevelSchema.parse(options.level ?? 0.95));
    case 'quartile':
      return quartileChannel(h);
    case 'mean-2sd':
      return meanTwoSdChannel(h);
  }
}

/** Broodcast's names of the three zones of a count against the channel. */
export const CHANNEL_ZONE_LABELS: Readonly<Record<ChannelZoneId, string>> = {
  below: 'Below the channel',
  within: 'Within the channel',
  above: 'Above the channel',
};

/** The zones in display order (low to high), with their labels. */
export const CHANNEL_ZONES: ReadonlyArray<{ id: ChannelZoneId; label: string }> = (
  ['below', 'within', 'above'] as const
).map((id) => ({ id, label: CHANNEL_ZONE_LABELS[id] }));

/**
 * The zone of a week's count against its band. The bounds belong to the channel: a count equal to
 * the upper bound is `within`; only a count strictly above it is `above` (likewise for `below`).
 */
export function channelZone(count: number, band: ChannelBand): ChannelZoneId {
  if (!Number.isFinite(count)) throw new RangeError(`count must be finite, got ${count}`);
  if (count > band.upper) return 'above';
  if (count < band.lower) return 'below';
  return 'within';
}
