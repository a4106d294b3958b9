import { describe, expect, it } from 'vitest';
import { emptyStationYear, FLAG_BITS, stationYearKey } from '../../server/weather/station-years.repository';
import { flagStationYears } from '../../server/weather/weather-flags';

const LIMITS = { runDays: 7, jumpC: 15, spatialC: 10 };

/** One station's 2026 with these daily (tmin, tmax) from 1 June (day index 151), every day this intake's. */
function year(days: [number, number][]) {
  const y = emptyStationYear('s1', 2026);
  const rows = new Int32Array(y.tmin.length);
  days.forEach(([lo, hi], k) => {
    y.tmin[151 + k] = lo;
    y.tmax[151 + k] = hi;
    rows[151 + k] = k + 2;
  });
  return { y, rows };
}

describe('weather flag rules: the jump from the day before', () => {
  it('when a day is 20 °C warmer than the day before, then it is flagged as a jump', () => {
    const m = year([[20, 30], [40, 50]]);
    const { findings } = flagStationYears([m], new Map([[stationYearKey('s1', 2026), m.y]]), [], LIMITS);
    expect(findings.map((f) => [f.rowNumber, f.jump])).toEqual([[3, true]]);
  });

  it('when the day before is held (a °F value in a °C file), then the next day is compared with the last value in use and not flagged', () => {
    // 22/31, then 72/88 (a day typed in °F, held by the plausibility check), then 23/32: the third day is
    // ordinary against the first; against the held value it would be a "jump" of 50 °C.
    const m = year([[22, 31], [72, 88], [23, 32]]);
    const held = new Uint8Array(m.rows.length);
    held[152] = 1;
    const { findings } = flagStationYears([m], new Map([[stationYearKey('s1', 2026), m.y]]), [], LIMITS, [held]);
    const third = findings.find((f) => f.rowNumber === 4);
    expect(third).toBeUndefined();
    // The held day itself is still measured against the day before it (its report line says why it is odd).
    expect(findings.find((f) => f.rowNumber === 3)?.jump).toBe(true);
  });

  it('when the held day was stored earlier (not this intake), then its stored flag keeps it out of the comparison', () => {
    const m = year([[22, 31], [72, 88], [23, 32]]);
    m.y.flags[152] = FLAG_BITS.held;
    m.rows[151] = 0;
    m.rows[152] = 0;
    const { findings } = flagStationYears([m], new Map([[stationYearKey('s1', 2026), m.y]]), [], LIMITS);
    expect(findings).toEqual([]);
  });

  it('when the last value in use is far from the new day, then the jump line quotes that value', () => {
    const m = year([[22, 31], [72, 88], [45, 55]]);
    const held = new Uint8Array(m.rows.length);
    held[152] = 1;
    const { findings } = flagStationYears([m], new Map([[stationYearKey('s1', 2026), m.y]]), [], LIMITS, [held]);
    expect(findings.find((f) => f.rowNumber === 4)).toMatchObject({ jump: true, ptmin: 22, ptmax: 31 });
  });

  it('when the days before the held day are missing, then there is nothing to compare with and no jump', () => {
    const m = year([[72, 88], [23, 32]]);
    const held = new Uint8Array(m.rows.length);
    held[151] = 1;
    const { findings } = flagStationYears([m], new Map([[stationYearKey('s1', 2026), m.y]]), [], LIMITS, [held]);
    expect(findings).toEqual([]);
  });
});
