import {
  aberration,
  channelZone,
  cusum,
  DEFAULT_SD_FLOOR,
  endemicChannel,
  growthSeries,
  incidencePer100k,
  logLinearGrowth,
  mean,
  sampleSd,
  type ChannelBand,
  type ChannelMethod,
  type ChannelZoneId,
} from '../../shared/signals';
import type { SignalNote } from '../../shared/api/cases.schema';

/**
 * The case signals of one district, disease and season, assembled from the pure statistics of
 * shared/signals (docs/case-ledger.md, "Signals"). No I/O: the service loads the counts and calls this.
 */

/** Seasons Bortman (1999) recommends for the channel: the 5 to 7 most recent prior seasons. */
export const CHANNEL_MAX_SEASONS = 7;
export const CHANNEL_RECOMMENDED_SEASONS = 5;
/** Years of counts to load before a season: the 7 channel seasons plus one that may be left out as epidemic. */
export const CHANNEL_LOOKBACK_YEARS = 8;
/** Weeks of the log-linear doubling-time fit (docs/signals.md: 3 to 6 is typical). */
export const FIT_WEEKS = 4;

export interface SignalsInput {
  year: number;
  /** Weeks of the target season to compute (up to the current week in the current season). */
  lastWeek: number;
  /** Weeks in the target week-year (52 or 53). */
  weeksInTargetYear: number;
  /** Counts by week-year: index 0 is week 1; null where nothing was reported. */
  counts: Map<number, (number | null)[]>;
  excludedYears: number[];
  method: ChannelMethod;
  cusum: { k: number; h: number };
  population: number | null;
  /**
   * The first open week of the target season (its reporting deadline has not passed and it is not
   * closed): from it on, weeks are shown with their partial counts but enter no statistic — no C1–C3,
   * CUSUM, channel zone or growth, and the fitted doubling time ends at the last complete week.
   * Null or absent: every week up to `lastWeek` is complete.
   */
  openFrom?: number | null;
}

export interface WeekSignal {
  week: number;
  cases: number | null;
  incidence: number | null;
  channel: ChannelBand | null;
  seasons: number;
  zone: ChannelZoneId | null;
  c1: { statistic: number | null; alarm: boolean | null };
  c2: { statistic: number | null; alarm: boolean | null };
  c3: { statistic: number | null; alarm: boolean | null };
  cusum: { statistic: number | null; alarm: boolean | null };
  growth: { ratio: number | null; percent: number | null; doublingWeeks: number | null };
  /** Reporting is still open for this week: its count is partial and every statistic of it is null. */
  open: boolean;
}

export interface SignalsResult {
  seasonsUsed: number[];
  weeks: WeekSignal[];
  fittedGrowth: { weeks: number; ratio: number; doublingWeeks: number | null } | null;
  /** The newest complete week of the target season (0 when none is). */
  lastCompleteWeek: number;
  /** Codes with parameters (shared/api/cases.schema.ts signalNote), worded by the client. */
  notes: SignalNote[];
}

/** The count of week `w` in a season; week 53 falls back to week 52 in a 52-week season. */
function valueAt(season: (number | null)[] | undefined, w: number): number | null {
  if (!season) return null;
  const v = season[w - 1];
  if (v !== undefined && v !== null) return v;
  if (w === 53) return season[51] ?? null;
  return null;
}

export function buildSignals(input: SignalsInput): SignalsResult {
  const notes: SignalNote[] = [];
  const excluded = new Set(input.excludedYears);
  const seasonsUsed = [...input.counts.keys()]
    .filter((y) => y < input.year && !excluded.has(y) && input.counts.get(y)!.some((v) => v !== null))
    .sort((a, b) => b - a)
    .slice(0, CHANNEL_MAX_SEASONS);
  if (seasonsUsed.length < 2) notes.push({ code: 'channel-too-few-seasons', params: { seasons: seasonsUsed.length } });
  else if (seasonsUsed.length < CHANNEL_RECOMMENDED_SEASONS)
    notes.push({ code: 'channel-few-seasons', params: { seasons: seasonsUsed.length, recommended: CHANNEL_RECOMMENDED_SEASONS, most: CHANNEL_MAX_SEASONS } });
  if (input.excludedYears.length) notes.push({ code: 'channel-excluded-years', params: { years: [...input.excludedYears].sort((a, b) => a - b) } });

  const current = input.counts.get(input.year) ?? [];
  const weeks = Array.from({ length: input.lastWeek }, (_, i) => i + 1);
  // Open weeks (reporting not over) are left out of every series statistic: a partial count read as
  // complete looks like a fall ("week on week −100 %") or hides a rise.
  const openFrom = input.openFrom ?? null;
  const lastCompleteWeek = openFrom === null ? input.lastWeek : Math.max(0, Math.min(input.lastWeek, openFrom - 1));
  const completeWeeks = weeks.slice(0, lastCompleteWeek);
  // Missing weeks count as zero in the series statistics; the completeness figure says how many are missing.
  const thisSeason = weeks.map((w) => current[w - 1] ?? null);
  const filled = thisSeason.slice(0, lastCompleteWeek).map((v) => v ?? 0);

  // C1–C3 need up to 11 weeks of lead-in: the previous season's weeks go in front of this one's.
  const previous = input.counts.get(input.year - 1) ?? [];
  const previousWeeks = Math.max(previous.length, 52);
  const lead = Array.from({ length: previousWeeks }, (_, i) => previous[i] ?? 0).slice(-11);
  const continuous = [...lead, ...filled];
  const tail = <T>(xs: T[]) => xs.slice(lead.length);
  const tests = (['c1', 'c2', 'c3'] as const).map((m) => {
    const r = aberration(m, continuous);
    return { statistic: tail(r.statistic), alarm: tail(r.alarm) };
  });

  const histories = weeks.map((w) =>
    seasonsUsed.map((y) => valueAt(input.counts.get(y), w)).filter((v): v is number => v !== null),
  );
  const bands = histories.map((h) => (h.length >= 2 ? endemicChannel(input.method, h) : null));

  // CUSUM of the counts standardised week by week against the same week of the prior seasons:
  // z_t = (x_t − μ_t) / max(σ_t, sd floor), then the tabular CUSUM with μ = 0 and σ = 1, restarted
  // at 0 after each alarm so a falling season leaves the alarm (issue 21).
  const z = filled.map((x, i) => {
    const h = histories[i];
    if (h.length < 2) return 0;
    return (x - mean(h)) / Math.max(sampleSd(h), DEFAULT_SD_FLOOR);
  });
  const cs = cusum({ series: z, mean: 0, sd: 1, k: input.cusum.k, h: input.cusum.h, restart: true });
  const growth = growthSeries(filled);

  let fittedGrowth: SignalsResult['fittedGrowth'] = null;
  const reported = thisSeason.slice(0, lastCompleteWeek).filter((v) => v !== null);
  const window = filled.slice(-FIT_WEEKS);
  if (reported.length >= FIT_WEEKS && window.every((v) => v > 0)) {
    const fit = logLinearGrowth(window);
    fittedGrowth = { weeks: FIT_WEEKS, ratio: fit.ratio, doublingWeeks: fit.doublingWeeks };
  }

  return {
    seasonsUsed,
    fittedGrowth,
    lastCompleteWeek,
    notes,
    weeks: weeks.map((w, i) => {
      const cases = thisSeason[i];
      const band = bands[i];
      if (i >= completeWeeks.length) {
        // An open week: its partial count and the channel band are shown; no statistic reads it.
        const none = { statistic: null, alarm: null };
        return {
          week: w, cases, incidence: cases === null || input.population === null ? null : incidencePer100k(cases, input.population),
          channel: band, seasons: histories[i].length, zone: null, c1: none, c2: none, c3: none, cusum: none,
          growth: { ratio: null, percent: null, doublingWeeks: null }, open: true,
        };
      }
      return {
        week: w,
        cases,
        incidence: cases === null || input.population === null ? null : incidencePer100k(cases, input.population),
        channel: band,
        seasons: histories[i].length,
        zone: cases === null || band === null ? null : channelZone(cases, band),
        c1: { statistic: tests[0].statistic[i], alarm: tests[0].alarm[i] },
        c2: { statistic: tests[1].statistic[i], alarm: tests[1].alarm[i] },
        c3: { statistic: tests[2].statistic[i], alarm: tests[2].alarm[i] },
        cusum: { statistic: cs.statistic[i], alarm: cs.alarm[i] },
        growth: growth[i],
        open: false,
      };
    }),
  };
}
