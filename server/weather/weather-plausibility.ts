import type { EntityManager } from 'typeorm';
import {
  doyDistance, type HeldFinding, type HeldReason, heldReason, judge, MIN_SAMPLE, type RobustStats, robustStats, WINDOW_DAYS,
} from '../../shared/weather/plausibility';
import { FLAG_BITS, readStationYears, type StationYear, stationYearKey } from './station-years.repository';
import type { Neighbour } from './weather-geo';

/** A row of the intake held as implausible, with each implausible value's figures. */
export interface HeldRow {
  rowNumber: number;
  stationId: string;
  day: number;
  reason: HeldReason;
  findings: HeldFinding[];
}

const COLUMNS = ['tmin', 'tmax', 'rh'] as const;
type Col = (typeof COLUMNS)[number];
const kindOf = (c: Col): 'rh' | 'temperature' => (c === 'rh' ? 'rh' : 'temperature');
const STATIONS_PER_READ = 200;
/**
 * Samples are made per 5-day block of the year, around the block's middle with a radius of WINDOW_DAYS + 2,
 * so every day of the block has at least its ± 15 days in the sample; a year of days then needs 73 samples
 * per column instead of 366 (the sorting is most of the check's cost).
 */
const BLOCK = 5;
const RADIUS = WINDOW_DAYS + 2;
const blockMiddle = (doy: number) => Math.floor(doy / BLOCK) * BLOCK + 2;
/**
 * About this many values make a sample (derived): with several years or neighbours, every 2nd (3rd, …)
 * day of the window is taken, evenly across it. A median and a MAD of 60–130 values are as good a yardstick as
 * of 500 for a limit of 3.5, and the check then costs about the same for 2 years of history as for 15.
 */
const SAMPLE_TARGET = 64;
const strideFor = (sources: number) => Math.max(1, Math.floor((sources * (2 * RADIUS + 1)) / SAMPLE_TARGET));

/**
 * The plausibility checks (shared/weather/plausibility.ts; docs/weather-intake.md § Plausibility) on the
 * days of an intake (`rows[i]` ≠ 0), after the merge. The station's own history is read from the
 * database as it was before this intake (the years this intake writes are not written yet; the years it
 * adds were not in `storedKeys`), up to `historyYears` years back; days already held are not part of any
 * sample. With fewer than MIN_SAMPLE values of history for a day, the neighbours' values of the same
 * ± 15 days of that year (the merged `years`, lapse-adjusted for temperatures) are the sample; with too
 * few of those either, the value is judged only by the row checks' physical bounds (done before).
 * Days whose values the intake brings unchanged (`unchanged[i]`) keep their held state and are not judged.
 * Returns, per merged year, 1 on each held day, and the held rows.
 */
export async function judgePlausibility(
  manager: EntityManager,
  merged: { y: StationYear; rows: Int32Array; unchanged?: Uint8Array }[],
  years: Map<string, StationYear>,
  nb: Neighbour[],
  storedKeys: Set<string>,
  opts: { tempUnit: 'C' | 'F'; historyYears: number },
): Promise<{ held: Uint8Array[]; rows: HeldRow[] }> {
  const held = merged.map(({ y }) => new Uint8Array(y.tmin.length));
  const rows: HeldRow[] = [];
  const byStation = new Map<string, number[]>();
  merged.forEach(({ y }, k) => byStation.set(y.stationId, [...(byStation.get(y.stationId) ?? []), k]));
  const around = new Map<string, Neighbour[]>();
  for (const n of nb) around.set(n.stationId, [...(around.get(n.stationId) ?? []), n]);

  let scratch = new Float64Array(1024);
  let n = 0;
  const push = (x: number) => {
    if (n === scratch.length) {
      const bigger = new Float64Array(scratch.length * 2);
      bigger.set(scratch);
      scratch = bigger;
    }
    scratch[n++] = x;
  };
  const EMPTY: RobustStats = { median: Number.NaN, mad: Number.NaN, n: 0 };
  const BLOCKS = Math.ceil(366 / BLOCK);
  const slot = (c: Col, day: number) => COLUMNS.indexOf(c) * BLOCKS + Math.floor(day / BLOCK);

  const stations = [...byStation.keys()];
  for (let s0 = 0; s0 < stations.length; s0 += STATIONS_PER_READ) {
    const part = stations.slice(s0, s0 + STATIONS_PER_READ);
    const keys: { stationId: string; year: number }[] = [];
    for (const stationId of part) {
      const ys = byStation.get(stationId)!.map((k) => merged[k].y.year);
      for (let yr = Math.min(...ys) - opts.historyYears; yr <= Math.max(...ys); yr++)
        if (storedKeys.has(stationYearKey(stationId, yr))) keys.push({ stationId, year: yr });
    }
    const history = await readStationYears(manager, keys);
    const historyOf = new Map<string, StationYear[]>();
    for (const h of history.values()) historyOf.set(h.stationId, [...(historyOf.get(h.stationId) ?? []), h]);

    for (const stationId of part) {
      const own = historyOf.get(stationId) ?? [];
      // The station's climatology by column and 5-day block, computed once per station (typed loops, no
      // callbacks: this runs for every block of every station of a national upload).
      const climate: (RobustStats | undefined)[] = new Array(COLUMNS.length * BLOCKS);
      const climateOf = (c: Col, day: number): RobustStats => {
        if (!own.length) return EMPTY;
        const at = slot(c, day);
        const hit = climate[at];
        if (hit) return hit;
        const mid = blockMiddle(day);
        const step = strideFor(own.length);
        n = 0;
        for (const h of own) {
          const len = h.tmin.length;
          const values = h[c];
          for (let d = -RADIUS; d <= RADIUS; d += step) {
            const i = (((mid + d) % len) + len) % len;
            if (doyDistance(i, mid) > RADIUS) continue;
            const x = values[i];
            if (x === x && (h.flags[i] & FLAG_BITS.held) === 0) push(x);
          }
        }
        return (climate[at] = robustStats(scratch, n));
      };
      for (const k of byStation.get(stationId)!) {
        const { y, rows: rowOf, unchanged } = merged[k];
        const ring = (around.get(stationId) ?? [])
          .map((m) => ({ m, ny: years.get(stationYearKey(m.neighbourId, y.year)) }))
          .filter((x): x is { m: Neighbour; ny: StationYear } => x.ny !== undefined);
        const nearStats: (RobustStats | undefined)[] = new Array(COLUMNS.length * BLOCKS);
        const neighbourStats = (c: Col, day: number): RobustStats => {
          if (!ring.length) return EMPTY;
          const at = slot(c, day);
          const hit = nearStats[at];
          if (hit) return hit;
          const mid = blockMiddle(day);
          const step = strideFor(ring.length);
          n = 0;
          for (const { m, ny } of ring) {
            const shift = c === 'rh' ? 0 : m.lapse;
            const values = ny[c];
            const last = Math.min(ny.tmin.length - 1, mid + RADIUS);
            for (let j = mid - RADIUS; j <= last; j += step) {
              if (j < 0) continue;
              const x = values[j];
              if (x === x && (ny.flags[j] & FLAG_BITS.held) === 0) push(x + shift);
            }
          }
          return (nearStats[at] = robustStats(scratch, n));
        };
        for (let i = 0; i < rowOf.length; i++) {
          if (rowOf[i] === 0 || unchanged?.[i]) continue;
          const findings: HeldFinding[] = [];
          const doy = i; // the year's arrays start on 1 January, so index = day of year (0-based)
          for (const c of COLUMNS) {
            const x = y[c][i];
            if (x !== x) continue;
            let stats = climateOf(c, doy);
            let basis: HeldFinding['basis'] = 'station';
            if (stats.n < MIN_SAMPLE) {
              stats = neighbourStats(c, doy);
              basis = 'neighbours';
              if (stats.n < MIN_SAMPLE) continue;
            }
            const v = judge(x, stats, kindOf(c), opts.tempUnit);
            if (!v.implausible) continue;
            findings.push({
              column: c, value: x, median: round2(stats.median), mad: round2(stats.mad), z: round2(v.z), n: stats.n, basis, alternative: v.alternative,
            });
          }
          if (!findings.length) continue;
          held[k][i] = 1;
          rows.push({ rowNumber: rowOf[i], stationId, day: y.start + i, reason: heldReason(findings, opts.tempUnit), findings });
        }
      }
    }
  }
  return { held, rows };
}

const round2 = (x: number) => Math.round(x * 100) / 100;
