import { FLAG_BITS, type StationYear, stationYearKey } from './station-years.repository';
import type { Neighbour } from './weather-geo';

export interface FlagLimits {
  /** Days of identical Tmin and Tmax in a row that make a run. */
  runDays: number;
  /** Largest day-to-day change of Tmin or Tmax, °C. */
  jumpC: number;
  /** Largest difference from the neighbours' estimate, °C. */
  spatialC: number;
}

/** A flagged day of the intake, with the figures its report line quotes. */
export interface FlagFinding {
  rowNumber: number;
  stationId: string;
  day: number;
  tmin: number;
  tmax: number;
  jump: boolean;
  run: boolean;
  spatial: boolean;
  ptmin: number;
  ptmax: number;
  runLength: number;
  etmin: number | null;
  etmax: number | null;
}

/**
 * The flag rules (docs/weather-intake.md § Flag) on the days of an intake (`rows[i]` ≠ 0: the file's row
 * number of day i), read against the merged values of every loaded year (`years`, by stationYearKey):
 * - jump: the station has a value in use the day before and Tmin or Tmax moved more than `jumpC`. A held
 *   day (docs/weather-intake.md § Plausibility) is not in use, so the day after it is compared with the
 *   last value before the held days (a day after a held °F day is not flagged against the held value);
 *   `held[k][i]` = 1 says day i of merged[k] is held after this intake (null: read the stored flags);
 * - run: the day is in a run of at least `runDays` consecutive days with the same Tmin and Tmax (the run
 *   is measured within `runDays` days either side of the year, which decides the rule exactly);
 * - spatial: at least two neighbours have a value that day, and Tmin or Tmax is more than `spatialC` from
 *   their inverse-distance weighted estimate (each neighbour adjusted for elevation by its lapse).
 * Returns each year's new flag bits (for the intake's days) and the findings.
 */
export function flagStationYears(
  merged: { y: StationYear; rows: Int32Array }[],
  years: Map<string, StationYear>,
  nb: Neighbour[],
  limits: FlagLimits,
  held: (Uint8Array | null)[] = [],
): { bits: Int16Array[]; findings: FlagFinding[] } {
  const byStation = new Map<string, Neighbour[]>();
  for (const n of nb) {
    const list = byStation.get(n.stationId);
    if (list) list.push(n);
    else byStation.set(n.stationId, [n]);
  }
  const R = limits.runDays;
  const findings: FlagFinding[] = [];
  const bits: Int16Array[] = [];
  // Scratch for the run rule: the year with R days either side.
  let extMin = new Float64Array(0);
  let extMax = new Float64Array(0);
  let runLen = new Int32Array(0);
  let extHeld = new Uint8Array(0);
  for (let k = 0; k < merged.length; k++) {
    const { y, rows } = merged[k];
    const heldNow = held[k] ?? null;
    const n = y.tmin.length;
    const out = new Int16Array(n);
    bits.push(out);
    const prev = years.get(stationYearKey(y.stationId, y.year - 1));
    const next = years.get(stationYearKey(y.stationId, y.year + 1));

    const len = n + 2 * R;
    if (extMin.length < len) {
      extMin = new Float64Array(len);
      extMax = new Float64Array(len);
      runLen = new Int32Array(len);
      extHeld = new Uint8Array(len);
    }
    // The year itself in the middle, then R days of the years either side (NaN where not loaded).
    extMin.fill(Number.NaN, 0, len);
    extMax.fill(Number.NaN, 0, len);
    extMin.set(y.tmin, R);
    extMax.set(y.tmax, R);
    // Whether each day is held (not in use): the intake's verdict for its days, the stored flag elsewhere.
    extHeld.fill(0, 0, len);
    for (let i = 0; i < n; i++) extHeld[i + R] = heldNow && rows[i] !== 0 ? heldNow[i] : (y.flags[i] & FLAG_BITS.held) !== 0 ? 1 : 0;
    if (prev) {
      const from = Math.max(0, prev.tmin.length - R);
      for (let d = from; d < prev.tmin.length; d++) extHeld[R - (prev.tmin.length - d)] = (prev.flags[d] & FLAG_BITS.held) !== 0 ? 1 : 0;
      extMin.set(prev.tmin.subarray(from), R - (prev.tmin.length - from));
      extMax.set(prev.tmax.subarray(from), R - (prev.tmax.length - from));
    }
    if (next) {
      extMin.set(next.tmin.subarray(0, Math.min(R, next.tmin.length)), R + n);
      extMax.set(next.tmax.subarray(0, Math.min(R, next.tmax.length)), R + n);
    }
    for (let j = 0; j < len; ) {
      let e = j + 1;
      if (extMin[j] === extMin[j]) while (e < len && extMin[e] === extMin[j] && extMax[e] === extMax[j]) e++;
      for (let k = j; k < e; k++) runLen[k] = e - j;
      j = e;
    }

    const around = (byStation.get(y.stationId) ?? []).map((m) => ({ m, ny: years.get(stationYearKey(m.neighbourId, y.year)) }))
      .filter((x) => x.ny !== undefined) as { m: Neighbour; ny: StationYear }[];

    for (let i = 0; i < n; i++) {
      if (rows[i] === 0) continue;
      const tmin = y.tmin[i];
      const tmax = y.tmax[i];
      // The day before, or the last day before it that is in use when it is held (within the R days kept).
      let p = i + R - 1;
      while (p > 0 && extHeld[p] && extMin[p] === extMin[p]) p--;
      const ptmin = extHeld[p] ? Number.NaN : extMin[p];
      const ptmax = extMax[p];
      const jump = ptmin === ptmin && (Math.abs(tmax - ptmax) > limits.jumpC || Math.abs(tmin - ptmin) > limits.jumpC);
      const run = runLen[i + R] >= R;
      let spatial = false;
      let etmin: number | null = null;
      let etmax: number | null = null;
      if (around.length >= 2) {
        let w = 0;
        let sMin = 0;
        let sMax = 0;
        let count = 0;
        for (const { m, ny } of around) {
          const a = ny.tmin[i];
          if (a !== a) continue;
          count++;
          w += m.weight;
          sMin += m.weight * (a + m.lapse);
          sMax += m.weight * (ny.tmax[i] + m.lapse);
        }
        if (count >= 2) {
          etmin = sMin / w;
          etmax = sMax / w;
          spatial = Math.abs(tmax - etmax) > limits.spatialC || Math.abs(tmin - etmin) > limits.spatialC;
        }
      }
      if (!(jump || run || spatial)) continue;
      out[i] = (jump ? FLAG_BITS.jump : 0) | (run ? FLAG_BITS.run : 0) | (spatial ? FLAG_BITS.spatial : 0);
      findings.push({
        rowNumber: rows[i], stationId: y.stationId, day: y.start + i, tmin, tmax, jump, run, spatial, ptmin, ptmax,
        runLength: runLen[i + R], etmin, etmax,
      });
    }
  }
  return { bits, findings };
}
