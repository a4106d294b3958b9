import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SeasonRepository } from '../../server/season/season.repository';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent, square } from '../support/factories';
import { csv, dayAfter, makeStation, WEATHER_TABLES } from '../support/weather-factories';

/** Issue 14, "void, never delete": a station's weather day entered in error is voided with a reason. */
let t: TestApp;
let officer: Awaited<ReturnType<typeof signedInAgent>>;
let district: { id: string };
let station: { id: string; code: string };
const HEADER = 'station,date,tmin,tmax,rh,rain';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
  district = await makeDistrict(t.ds, { boundary: square(60, 10), centroidLat: 10.5, centroidLon: 60.5 });
  station = await makeStation(t.ds, { latitude: 10.5, longitude: 60.5 });
  const rows = Array.from({ length: 10 }, (_, i) => [station.code, dayAfter('2026-03-01', i), 15 + i, 25 + i, 60, 1]);
  rows[4] = [station.code, '2026-03-05', 41, 58, 60, 1]; // the day entered in error
  const res = await officer.post('/api/weather/uploads?wait=true').field('tempUnit', 'C').field('rainUnit', 'mm')
    .attach('file', Buffer.from(csv(HEADER, rows)), 'weather.csv');
  expect(res.body).toMatchObject({ status: 'done', rowsAccepted: 10 });
});
afterAll(() => t.close());

const rows = () => countRows(t.ds, ...WEATHER_TABLES);
const fingerprint = async () => (await new SeasonRepository(t.ds).fingerprints('2026-01-01', '2026-03-31', 2020)).get(district.id);

describe('voiding a weather day', () => {
  it('when the reason is missing, then 400 names reason; when an epidemiologist or a worker voids, then 403; nothing is written', async () => {
    const before = await rows();
    const res = await officer.post('/api/weather/observations/void').send({ station: station.code, date: '2026-03-05' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain('reason');
    for (const role of ['epidemiologist', 'worker', 'supervisor']) {
      const other = await signedInAgent(t.app, (await makeUser(t.ds, { role: role as never, districtIds: [district.id] })).email);
      expect((await other.post('/api/weather/observations/void').send({ station: station.code, date: '2026-03-05', reason: 'x' })).status).toBe(403);
    }
    const none = await officer.post('/api/weather/observations/void').send({ station: station.code, date: '2026-03-20', reason: 'x' });
    expect(none.status).toBe(400);
    expect(none.body.error.fields[0].path).toBe('date');
    expect(await rows()).toEqual(before);
  });

  it('when an officer voids the day, then it leaves the station\'s days and the district series, its values stay in the revisions with the reason, and the season input changes', async () => {
    const printBefore = await fingerprint();
    const before = await rows();
    const res = await officer.post('/api/weather/observations/void').send({ station: station.code, date: '2026-03-05', reason: 'Sensor in the sun' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ date: '2026-03-05', voided: { tmin: 41, tmax: 58, reason: 'Sensor in the sun' }, districtsRecomputed: 1 });
    const after = await rows();
    expect(after.weather_observations).toBe(before.weather_observations - 1);
    expect(after.weather_observation_revisions).toBe(before.weather_observation_revisions + 1);
    expect(after.audit_events).toBe(before.audit_events + 1);

    const days = await officer.get(`/api/weather/stations/${station.id}/days?from=2026-03-01&to=2026-03-10`);
    expect(days.body.days.map((d: { date: string }) => d.date)).not.toContain('2026-03-05');
    const revs = await officer.get(`/api/weather/stations/${station.id}/revisions?date=2026-03-05`);
    expect(revs.body.revisions).toEqual([expect.objectContaining({ tmin: 41, tmax: 58, kind: 'void', reason: 'Sensor in the sun' })]);
    const series = await t.ds.query(`SELECT tmax, filled FROM district_weather_days WHERE district_id = $1 AND date = '2026-03-05'`, [district.id]);
    expect(series.every((d: { tmax: number; filled: boolean }) => d.tmax !== 58)).toBe(true);
    expect(await fingerprint()).not.toBe(printBefore);
  });
});
