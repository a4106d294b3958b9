import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeDistrict, makeUser, signedInAgent, square } from '../support/factories';
import { csv, dayAfter, makeStation } from '../support/weather-factories';
import { referenceSeries, storedSeries } from '../support/series-reference';

// Issue 17: the district series are recomputed only for the districts and days whose inputs changed, in set
// SQL. These tests hold the stored series to the first implementation's results (tests/support/series-reference.ts:
// every district's whole history recomputed from scratch) after each kind of change.

let t: TestApp;
let officer: Awaited<ReturnType<typeof signedInAgent>>;
const HEADER = 'station,date,tmin,tmax,rh,rain';
let districts: string[];
let codes: { s1: string; s2: string; s3: string };

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
  // A: two stations inside; B: one inside; C: none, interpolated from the three nearest.
  const a = await makeDistrict(t.ds, { boundary: square(120, 40), centroidLat: 40.5, centroidLon: 120.5 });
  const b = await makeDistrict(t.ds, { boundary: square(121, 40), centroidLat: 40.5, centroidLon: 121.5 });
  const c = await makeDistrict(t.ds, { boundary: square(122, 40), centroidLat: 40.5, centroidLon: 122.5 });
  districts = [a.id, b.id, c.id];
  const s1 = await makeStation(t.ds, { latitude: 40.3, longitude: 120.3 });
  const s2 = await makeStation(t.ds, { latitude: 40.7, longitude: 120.7 });
  const s3 = await makeStation(t.ds, { latitude: 40.5, longitude: 121.5 });
  codes = { s1: s1.code, s2: s2.code, s3: s3.code };
});
afterAll(() => t.close());

const upload = (rows: (string | number)[][]) =>
  officer.post('/api/weather/uploads?wait=true').field('tempUnit', 'C').field('rainUnit', 'mm')
    .attach('file', Buffer.from(csv(HEADER, rows)), 'weather.csv');

/** Plausible days for a station: odd weights and thirds so the weighted means need rounding. */
const days = (code: string, start: string, offsets: number[], base: number) =>
  offsets.map((i) => [code, dayAfter(start, i), (base + (i % 7) / 3).toFixed(2), (base + 9 + (i % 5) / 3).toFixed(2), i % 4 === 0 ? '' : 55 + (i % 9), i % 3 === 0 ? '' : (i % 5) * 0.7]);
const range = (from: number, to: number, skip: number[] = []) => Array.from({ length: to - from + 1 }, (_, k) => from + k).filter((i) => !skip.includes(i));

const expectSameAsReference = async () => {
  const max = t.ctx.config.WEATHER_FILL_MAX_DAYS;
  const expected = await t.ds.transaction((m) => referenceSeries(m, districts, max));
  expect(expected.length).toBeGreaterThan(0);
  expect(await storedSeries(t.ds, districts)).toEqual(expected);
};
const versions = () => t.ds.query('SELECT district_id, date, xmin::text AS v FROM district_weather_days WHERE district_id = ANY($1::uuid[]) ORDER BY 1, 2', [districts]);

describe('district series recomputed by changed days', () => {
  it('when a first upload brings several stations with short and long gaps, then the series equal the whole recompute', async () => {
    const res = await upload([
      ...days(codes.s1, '2026-01-01', range(0, 29, [5, 6, 15, 16, 17, 18, 19, 20, 21, 22]), 8),
      ...days(codes.s2, '2026-01-01', range(0, 29, [10]), 9),
      ...days(codes.s3, '2026-01-01', range(3, 25, [12, 13, 14, 15, 16]), 11),
    ]);
    expect(res.body).toMatchObject({ status: 'done', rowsRejected: 0 });
    await expectSameAsReference();
  });

  it('when a later upload changes a day in the middle, splits a long gap, extends the end and reaches back into the previous year, then the series equal the whole recompute', async () => {
    const res = await upload([
      [codes.s1, '2026-01-13', 3.33, 14.67, 70, 2.1], // changed
      ...days(codes.s1, '2026-01-01', [18], 8), // inside the long gap: two gaps now
      ...days(codes.s3, '2026-01-01', range(26, 40), 11), // past the end
      ...days(codes.s2, '2025-12-01', [28, 29], 9), // back across the new year, leaving a short gap on 31 December
    ]);
    expect(res.body).toMatchObject({ status: 'done', rowsRejected: 0 });
    await expectSameAsReference();
  });

  it('when the same rows are sent again, then no day of any series is rewritten', async () => {
    const rows = [...days(codes.s1, '2026-01-01', range(0, 4), 8), ...days(codes.s3, '2026-01-01', range(26, 40), 11)];
    const before = await versions();
    const res = await upload(rows);
    expect(res.body).toMatchObject({ status: 'done', rowsRejected: 0, rowsReplaced: 0 });
    expect(await versions()).toEqual(before);
    await expectSameAsReference();
  });

  it('when a station is added with its own days, then the districts whose sources changed get their whole series again, equal to the whole recompute', async () => {
    const s4 = await makeStation(t.ds, { latitude: 40.2, longitude: 121.2 });
    await expectSameAsReference();
    const res = await upload(days(s4.code, '2026-01-01', range(2, 20, [9, 10]), 10));
    expect(res.body).toMatchObject({ status: 'done', rowsRejected: 0 });
    await expectSameAsReference();
  });

  it('when a day is voided, then the series equal the whole recompute', async () => {
    const res = await officer.post('/api/weather/observations/void').send({ station: codes.s3, date: '2026-01-05', reason: 'Sensor in the sun' });
    expect(res.status).toBe(200);
    await expectSameAsReference();
  });
});
