import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { ALL_TABLES, countRows, makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { CASES_TABLES, disease, makeReportingDistrict, weeksAgo } from '../support/cases-factories';
import { csv, makeStation, WEATHER_TABLES } from '../support/weather-factories';

/**
 * Ordinary mistakes at the edge of the API: impossible dates, an id listed twice, a CSV without rows or
 * with a column named twice. Each is a 4xx (or a row-level rejection) that names the field, and
 * writes nothing; none reaches PostgreSQL to come back as a 500.
 */

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let t: TestApp;
let officer: Agent;
let admin: Agent;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
  admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
});
afterAll(() => t.close());

const paths = (res: { body: { error?: { fields?: { path: string }[] } } }) => (res.body.error?.fields ?? []).map((f) => f.path);
const STATION_TABLES = ['weather_stations', ...WEATHER_TABLES];

describe('impossible dates', () => {
  it('when an officer gives a station an impossible or ancient active date, then it is a 400 naming the field and nothing is written', async () => {
    const before = await countRows(t.ds, ...STATION_TABLES);
    const cases = [
      [{ activeFrom: '2026-02-30' }, 'activeFrom'],
      [{ activeFrom: '0000-01-01' }, 'activeFrom'],
      [{ activeFrom: '0001-01-01' }, 'activeFrom'],
      [{ activeTo: '2026-13-01' }, 'activeTo'],
      [{ activeTo: '2023-02-29' }, 'activeTo'],
    ] as const;
    for (const [dates, field] of cases) {
      const res = await officer.post('/api/weather/stations').send({ code: `DT-${randomUUID().slice(0, 8)}`, name: 'Dates', latitude: 1, longitude: 1, ...dates });
      expect(res.status, JSON.stringify(dates)).toBe(400);
      expect(paths(res)).toEqual([field]);
    }
    const station = await makeStation(t.ds, { latitude: 2, longitude: 2 });
    const patch = await officer.patch(`/api/weather/stations/${station.id}`).send({ activeTo: '2026-02-30' });
    expect(patch.status).toBe(400);
    expect(paths(patch)).toEqual(['activeTo']);
    expect(await countRows(t.ds, ...STATION_TABLES)).toEqual({ ...before, weather_stations: before.weather_stations + 1 });
    const leap = await officer.post('/api/weather/stations').send({ code: `DT-${randomUUID().slice(0, 8)}`, name: 'Leap', latitude: 1, longitude: 1, activeFrom: '2024-02-29' });
    expect(leap.status).toBe(201);
  });

  it('when a station’s days or revisions are asked with an impossible date, then it is a 400 naming the query field', async () => {
    const station = await makeStation(t.ds, { latitude: 3, longitude: 3 });
    for (const [url, field] of [
      [`/api/weather/stations/${station.id}/days?from=2026-02-30`, 'from'],
      [`/api/weather/stations/${station.id}/days?to=0099-06-15`, 'to'],
      [`/api/weather/stations/${station.id}/revisions?date=2026-99-99`, 'date'],
      [`/api/weather/districts/${randomUUID()}/series?from=2026-02-30`, 'from'],
    ] as const) {
      const res = await officer.get(url);
      expect(res.status, url).toBe(400);
      expect(paths(res)).toEqual([field]);
    }
    expect((await officer.get(`/api/weather/stations/${station.id}/days?from=2024-02-29`)).status).toBe(200);
  });

  it('when a survey is dated 0000-01-01, 0001-01-01 or 2026-02-30, then it is a 400 naming the date and nothing is written', async () => {
    const district = await makeDistrict(t.ds);
    const before = await countRows(t.ds, ...CASES_TABLES);
    for (const date of ['0000-01-01', '0001-01-01', '2026-02-30', '1899-12-31']) {
      const res = await officer.post('/api/surveys').send({
        id: randomUUID(), districtId: district.id, locality: 'Ward', date,
        housesInspected: 10, housesPositive: 0, containersInspected: 10, containersPositive: 0,
      });
      expect(res.status, date).toBe(400);
      expect(paths(res)).toEqual(['date']);
    }
    expect(await countRows(t.ds, ...CASES_TABLES)).toEqual(before);
  });

  it('when a weather file holds the year 0099 or 2026-02-30, then those rows are rejected naming the date, and nothing is stored in the 1900s', async () => {
    const station = await makeStation(t.ds, { latitude: 4, longitude: 4 });
    const res = await officer
      .post('/api/weather/uploads?wait=true')
      .attach('file', Buffer.from(csv('station,date,tmin,tmax', [[station.code, '0099-06-15', 10, 20], [station.code, '2026-02-30', 10, 20], [station.code, '2026-01-05', 10, 20]])), 'w.csv');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'done', rowsAccepted: 1, rowsRejected: 2 });
    const issues = await officer.get(`/api/weather/uploads/${res.body.id}/issues`);
    expect(issues.body.issues.map((i: { column: string; value: string; rule: string }) => [i.column, i.value, i.rule])).toEqual([
      ['date', '0099-06-15', 'date-range'],
      ['date', '2026-02-30', 'bad-date'],
    ]);
    const stored = await t.ds.query(`SELECT to_char(date, 'YYYY-MM-DD') AS d FROM weather_observations WHERE station_id = $1`, [station.id]);
    expect(stored.map((r: { d: string }) => r.d)).toEqual(['2026-01-05']);
    const correction = await officer.put('/api/weather/observations').send({ station: station.code, date: '0099-06-15', tmin: 3, tmax: 13 });
    expect(correction.status).toBe(400);
    expect(paths(correction)).toEqual(['date']);
  });
});

describe('an id listed twice', () => {
  it('when an admin invites or edits a user with the same district twice, then it is a 400 naming districtIds and nothing is written', async () => {
    const d = await makeDistrict(t.ds);
    const before = await countRows(t.ds, ...ALL_TABLES);
    const invite = await admin.post('/api/users').send({ email: `twice-${randomUUID().slice(0, 6)}@test.example`, displayName: 'Twice', role: 'worker', districtIds: [d.id, d.id] });
    expect(invite.status).toBe(400);
    expect(paths(invite)).toEqual(['districtIds']);
    const user = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    const mid = await countRows(t.ds, ...ALL_TABLES);
    const patch = await admin.patch(`/api/users/${user.id}`).send({ districtIds: [d.id, d.id] });
    expect(patch.status).toBe(400);
    expect(paths(patch)).toEqual(['districtIds']);
    expect(await countRows(t.ds, ...ALL_TABLES)).toEqual(mid);
    expect(mid.users).toBe(before.users + 1);
  });

  it('when a subscription list, a disease’s profiles or a flag’s actions repeat an id, then each is a 400 naming the list', async () => {
    const d = await makeDistrict(t.ds);
    const subs = await officer.put('/api/subscriptions/me').send({ districts: [{ districtId: d.id, advisory: true, bulletin: true }, { districtId: d.id, advisory: false, bulletin: true }] });
    expect(subs.status).toBe(400);
    expect(paths(subs)).toEqual(['districts']);
    const dis = await admin.post('/api/diseases').send({ code: 'TWICE-1', name: 'Twice', profileIds: ['aedes-aegypti-dengue', 'aedes-aegypti-dengue'] });
    expect(dis.status).toBe(400);
    expect(paths(dis)).toEqual(['profileIds']);
    const flag = await officer.post('/api/flags').send({ districtId: d.id, note: 'Seen twice', actions: ['source-reduction', 'source-reduction'] });
    expect(flag.status).toBe(400);
    expect(paths(flag)).toEqual(['actions']);
  });
});

describe('CSV headers and empty files', () => {
  it('when an epidemiologist uploads a case file with a header and no rows, or a column named twice, then it is refused naming the problem and nothing is written', async () => {
    const own = await makeReportingDistrict(t.ds);
    await disease(t.ds, 'DENV');
    const epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist', districtIds: [own.id] })).email);
    const w = weeksAgo(2);
    const before = await countRows(t.ds, ...CASES_TABLES);
    const empty = await epi.post('/api/cases/uploads').attach('file', Buffer.from('district,year,week,disease,cases\n\n'), 'empty.csv');
    expect(empty.status).toBe(422);
    expect(empty.body.error.code).toBe('upload_rejected');
    expect(empty.body.report.problems).toMatchObject([{ row: 1, column: null, reason: expect.stringMatching(/header but no rows/) }]);
    const twice = await epi
      .post('/api/cases/uploads')
      .attach('file', Buffer.from(`district,year,week,disease,cases,district\n${own.code},${w.year},${w.week},DENV,4,NOPE\n`), 'twice.csv');
    expect(twice.status).toBe(422);
    expect(twice.body.report.problems).toMatchObject([{ row: 1, column: 'district', reason: expect.stringMatching(/more than once/) }]);
    expect(await countRows(t.ds, ...CASES_TABLES)).toEqual(before);
  });

  it('when a weather file names a column twice, then the whole file is refused naming it and nothing is stored', async () => {
    const station = await makeStation(t.ds, { latitude: 5, longitude: 5 });
    const before = await countRows(t.ds, ...WEATHER_TABLES);
    const res = await officer
      .post('/api/weather/uploads?wait=true')
      .attach('file', Buffer.from(csv('station,date,tmin,tmax,tmax', [[station.code, '2026-01-05', 10, 20, 30]])), 'w.csv');
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('bad_header');
    const upload = (await officer.get(`/api/weather/uploads`)).body.uploads[0];
    expect(upload.status).toBe('refused');
    expect(upload.message).toMatch(/tmax appears twice/);
    const stored = await t.ds.query(`SELECT count(*)::int AS n FROM weather_observations WHERE station_id = $1`, [station.id]);
    expect(stored[0].n).toBe(0);
    const after = await countRows(t.ds, ...WEATHER_TABLES);
    expect(after.weather_observations).toBe(before.weather_observations);
  });
});
