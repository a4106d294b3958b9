import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  checkRow, dayOfIsoDate, fillGaps, idwWeights, plainNumber, readHeader, rhFromDewPoint, type RowIssue, toCelsius, toMillimetres,
} from '../../shared/weather/qc';
import { csvCell } from '../../shared/csv';
import { relativeHumidityFromDewPoint } from '../../shared/model';
import { buildDemoStations } from '../../sample/demo-stations';
import { demoWeather } from '../../sample/demo-weather';

const ctx = {
  stations: new Map([['S1', { id: 'id-1', activeFrom: dayOfIsoDate('2020-01-01'), activeTo: Infinity }]]),
  tempUnit: 'C' as 'C' | 'F', rainUnit: 'mm' as 'mm' | 'in', lastDay: dayOfIsoDate('2026-12-01'),
};
const header = readHeader(['station', 'date', 'tmin', 'tmax', 'rh', 'dewpoint', 'rain']);
const col = 'index' in header ? header.index : (null as never);
const check = (rec: string[], c = ctx) => {
  const issues: RowIssue[] = [];
  return { row: checkRow(rec, col, 2, c, issues), issues };
};

describe('weather quality rules', () => {
  it('when units are °F and inches, then they are converted to °C and mm', () => {
    expect(toCelsius(212, 'F')).toBeCloseTo(100, 10);
    expect(toCelsius(-40, 'F')).toBeCloseTo(-40, 10);
    expect(toMillimetres(1, 'in')).toBe(25.4);
    const { row } = check(['S1', '2026-01-01', '50', '86', '', '', '2'], { ...ctx, tempUnit: 'F', rainUnit: 'in' });
    expect(row).toMatchObject({ tmin: 10, tmax: 30, rain: 50.8 });
  });

  it('when only the dew point is given, then RH comes from it and the mean temperature (Magnus, Alduchov & Eskridge 1996)', () => {
    const { row } = check(['S1', '2026-01-01', '10', '20', '', '10', '']);
    expect(row!.rh).toBeCloseTo(relativeHumidityFromDewPoint(15, 10), 0);
    expect(rhFromDewPoint(20, 15)).toBe(100);
    expect(check(['S1', '2026-01-01', '10', '20', '', '25', '']).issues[0].rule).toBe('dewpoint-limits');
  });

  it('when a row breaks several rules, then every failing column is named', () => {
    const { row, issues } = check(['S9', '2026-13-01', 'x', '99', '120', '', '-1']);
    expect(row).toBeNull();
    expect(issues.map((i) => `${i.column}:${i.rule}`)).toEqual(['station:unknown-station', 'date:bad-date', 'tmin:bad-number', 'tmax:temp-limits', 'rh:rh-range', 'rain:rain-limits']);
  });

  it('when the limits are reached but not passed, then the row is accepted (WMO extremes: −89.2 °C, 56.7 °C, 1,825 mm)', () => {
    expect(check(['S1', '2026-01-01', '-89.2', '56.7', '0', '', '1825']).row).not.toBeNull();
    expect(check(['S1', '2019-12-31', '1', '2', '', '', '']).issues[0].rule).toBe('inactive-station');
    expect(check(['S1', '2026-12-02', '1', '2', '', '', '']).issues[0].rule).toBe('future-date');
  });

  it('when the header lacks columns, has unknown ones or is data, then it says which', () => {
    expect(readHeader(['station', 'date', 'tmin'])).toEqual({ problem: expect.stringMatching(/missing tmax/) });
    expect(readHeader(['station', 'date', 'tmin', 'tmax', 'wind'])).toEqual({ problem: expect.stringMatching(/unknown "wind"/) });
    expect(readHeader(['S1', '2026-01-01', '1', '2'])).toEqual({ problem: expect.stringMatching(/looks like a row of data/) });
  });

  it('when a gap is up to the fill limit, then it is filled linearly; longer, then its days are missing', () => {
    const d = (day: number, t: number) => ({ day, tmin: t, tmax: t + 10, rh: 50, rain: 1, stationCount: 1 });
    const s = fillGaps([d(0, 0), d(4, 8), d(9, 0)], 3);
    expect(s).toHaveLength(10);
    expect(s.slice(1, 4).map((x) => [x.tmin, x.filled, x.rain])).toEqual([[2, true, null], [4, true, null], [6, true, null]]);
    expect(s.slice(5, 9).every((x) => x.tmin === null && !x.filled)).toBe(true);
  });

  it('when weights are inverse-distance, then nearer counts more and they sum to one (Shepard 1968)', () => {
    const w = idwWeights([10, 20]);
    expect(w[0] / w[1]).toBeCloseTo(4, 10);
    expect(w[0] + w[1]).toBeCloseTo(1, 10);
    expect(idwWeights([0, 5])).toEqual([1, 0]);
  });

  it('when a cell starts like a formula, then the CSV cell is prefixed with an apostrophe and quoted if needed', () => {
    expect(['=1+1', '+1', '-2', '@A', '\tx', '\rx', 'ok', 'a,b', 'q"'].map(csvCell)).toEqual(
      ["'=1+1", "'+1", "'-2", "'@A", "'\tx", "\"'\rx\"", 'ok', '"a,b"', '"q"""'],
    );
    // One writer for the browser and the server: a negative number is data, written as it is.
    expect([-2, 0.5, null, undefined, Number.NaN].map(csvCell)).toEqual(['-2', '0.5', '', '', '']);
  });

  it('when the demo weather is generated twice, then it is the same, and summer is warm enough for vectors in every zone', () => {
    const a = demoWeather('2026-07-01', '2026-07-31');
    expect(demoWeather('2026-07-01', '2026-07-31')).toEqual(a);
    const stations = buildDemoStations();
    expect(stations.length).toBe(11);
    const meanTmax = (zone: string, from: string, to: string) => {
      const codes = new Set(stations.filter((s) => s.zone === zone).map((s) => s.code));
      const rows = demoWeather(from, to).filter((r) => codes.has(r.station));
      return rows.reduce((x, r) => x + r.tmax, 0) / rows.length;
    };
    expect(meanTmax('coast', '2026-07-01', '2026-07-31')).toBeGreaterThan(28);
    expect(meanTmax('plateau', '2026-07-01', '2026-07-31')).toBeGreaterThan(24);
    expect(meanTmax('plateau', '2026-01-01', '2026-01-31')).toBeLessThan(12);
    for (const r of a) expect(r.tmin).toBeLessThanOrEqual(r.tmax);
  });
});

describe('reading numbers', () => {
  it('when a field is a plain decimal number, then it reads as exactly the value Number() gives', () => {
    const decimal = fc.tuple(fc.constantFrom('', '+', '-'), fc.stringMatching(/^\d{0,12}$/), fc.boolean(), fc.stringMatching(/^\d{0,8}$/))
      .map(([sign, whole, point, frac]) => `${sign}${whole}${point ? '.' : ''}${point ? frac : ''}`)
      .filter((t) => /\d/.test(t));
    fc.assert(fc.property(decimal, (t) => Object.is(plainNumber(t), Number(t))), { numRuns: 5000 });
    // More than 15 digits: left to Number().
    expect(plainNumber('1234567890.1234567')).toBe(1234567890.1234567);
  });

  it('when a field is not a plain decimal number, then it is refused (no exponent, hex, inner space or second point)', () => {
    for (const t of ['1e5', '0x10', '1.2.3', '.', '+', '-', '1 2', 'Infinity', 'NaN', '٣', '1,5']) expect(plainNumber(t), t).toBeUndefined();
    for (const [t, v] of [['-.5', -0.5], ['1.', 1], ['+3', 3], ['007', 7], ['-0', -0]] as const) expect(Object.is(plainNumber(t), v), t).toBe(true);
  });
});
