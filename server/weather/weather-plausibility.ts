import type { EntityManager } from 'typeorm';
import {
  dayOfYear, doyDistance, type HeldFinding, type HeldReason, heldReason, judge, MIN_SAMPLE, type RobustStats, robustStats, WINDOW_DAYS,
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
  const sampleOf = (fill: (push: (x: number) => void) => void): RobustStats => {
    let n = 0;
    fill((x) => {
      if (n === scratch.length) {
        const bigger = new Float64Array(scratch.length * 2);
        bigger.set(scratch);
        scratch = bigger;
      }
      scratch[n++] = x;
    });
    return robustStats(scratch, n);
  };

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
      // The station's climatology by column and day of year (0–365), computed once per station.
      const climate = new Map<string, RobustStats>();
      const climateOf = (c: Col, day: number) => {
        const doy = blockMiddle(day);
        const key = `${c}|${doy}`;
        let s = climate.get(key);
        if (!s) {
          s = sampleOf((push) => {
            for (const h of own) {
              const len = h.tmin.length;
              for (let d = -RADIUS; d <= RADIUS; d++) {
                const i = (((doy + d) % len) + len) % len;
                if (doyDistance(i, doy) > RADIUS) continue;
                const x = h[c][i];
                if (x === x && (h.flags[i] & FLAG_BITS.held) === 0) push(x);
              }
            }
          });
          climate.set(key, s);
        }
        return s;
      };
      for (const k of byStation.get(stationId)!) {
        const { y, rows: rowOf, unchanged } = merged[k];
        const ring = (around.get(stationId) ?? [])
          .map((m) => ({ m, ny: years.get(stationYearKey(m.neighbourId, y.year)) }))
          .filter((x): x is { m: Neighbour; ny: StationYear } => x.ny !== undefined);
        const nearStats = new Map<string, RobustStats>();
        const neighbourStats = (c: Col, day: number) => {
          const mid = blockMiddle(day);
          const key = `${c}|${mid}`;
          let s = nearStats.get(key);
          if (!s) {
            s = sampleOf((push) => {
              for (const { m, ny } of ring) {
                const shift = c === 'rh' ? 0 : m.lapse;
                for (let j = Math.max(0, mid - RADIUS); j <= Math.min(ny.tmin.length - 1, mid + RADIUS); j++) {
                  const x = ny[c][j];
                  if (x === x && (ny.flags[j] & FLAG_BITS.held) === 0) push(x + shift);
                }
              }
            });
            nearStats.set(key, s);
          }
          return s;
        };
        for (let i = 0; i < rowOf.length; i++) {
          if (rowOf[i] === 0 || unchanged?.[i]) continue;
          const findings: HeldFinding[] = [];
          const doy = dayOfYear(y.start + i);
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
