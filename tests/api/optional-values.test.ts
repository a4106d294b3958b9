import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent, square } from '../support/factories';
import { disease, weeksAgo } from '../support/cases-factories';
import { csv } from '../support/weather-factories';
import { makeCaseHistory, makeSeasonDistrict } from '../support/season-factories';

/**
 * Optional numbers are optional everywhere: a value left out and a value sent as null mean the same
 * thing, in the schema and in every reader of the stored row (District file, season run, bulletin).
 */

let t: TestApp;
let district: { id: string; name: string };
const AS_OF = '2026-08-20';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  district = await makeSeasonDistrict(t.ds, { warmth: 2 });
  await makeCaseHistory(t.ds, district.id, { base: 2, year: 2026, current: Array.from({ length: 33 }, () => 3) });
});
afterAll(() => t.close());

const survey = (overrides: Record<string, unknown>) => ({
  id: randomUUID(),
  districtId: district.id,
  locality: 'Harbour ward',
  date: '2026-08-17',
  housesInspected: 100,
  housesPositive: 10,
  containersInspected: 300,
  containersPositive: 20,
  containerTypes: [],
  ...overrides,
});

describe('optional values left empty', () => {
  it('when a community worker saves a survey without pupae, then the District file, the season run and the bulletin still work', async () => {
    const worker = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [district.id] })).email);
    // Online (the field left out), offline and sent later (the field sent as null), and one that counted pupae.
    const withoutPupae = survey({});
    expect('pupae' in withoutPupae).toBe(false);
    expect((await worker.post('/api/surveys').send(withoutPupae)).status).toBe(201);
    expect((await worker.post('/api/surveys').send(survey({ pupae: null, notes: null, date: '2026-08-18' }))).status).toBe(201);
    const counted = await worker.post('/api/surveys').send(survey({ pupae: 40, housesInspected: 50, date: '2026-08-19' }));
    expect(counted.status).toBe(201);
    expect(counted.body.indices.pupa).toBeCloseTo(80, 9); // 40 pupae per 50 houses = 80 per 100 houses [derived]

    const run = await runSeasonNow(t.ctx, { asOf: AS_OF });
    expect(run!.error).toBeNull();
    expect(run!.status).toBe('succeeded');
    expect(run!.districtsDone).toBe(1);

    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const file = await officer.get(`/api/districts/${district.id}/file`);
    expect(file.status).toBe(200);
    const [week] = file.body.larval;
    expect(week.surveys).toBe(3);
    // The pupa index is computed over the surveys that counted pupae (one of three, 50 houses), not hidden.
    expect(week.pupaSurveys).toBe(1);
    expect(week.pupa).toBeCloseTo(80, 9);
    // House index pools all three: 30 positive of 250 houses = 12 % [derived].
    expect(week.house).toBeCloseTo(12, 9);

    const own = await worker.get(`/api/districts/${district.id}/surveys`);
    expect(own.status).toBe(200);
    expect(own.body.surveys.filter((s: { pupae: number | null }) => s.pupae === null)).toHaveLength(2);
    expect(own.body.weeks[0].indices.pupa).toBeCloseTo(80, 9);
    expect(own.body.weeks[0].pupaSurveys).toBe(1);

    const sup = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
    expect((await sup.get(`/api/bulletins/preview?districtId=${district.id}`)).status).toBe(200);
    expect((await sup.get(`/api/bulletins/preview/html?districtId=${district.id}`)).status).toBe(200);
    const sent = await sup.post('/api/bulletins/send').send({});
    expect(sent.status).toBe(200);
    expect(sent.body.bulletinsWritten).toBe(1);
  });

  it('when the optional case split, humidity, rain and station elevation are left out or sent as null, then entry, reading, the District file and the season run still work', async () => {
    // Case counts: the split left out, then corrected with every optional part sent as null.
    await t.ds.query(`INSERT INTO case_district_settings (district_id, active_from) VALUES ($1, '2015-01-01') ON CONFLICT DO NOTHING`, [district.id]);
    const dengue = await disease(t.ds, 'DENV');
    const epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist', districtIds: [district.id] })).email);
    const w = weeksAgo(1);
    const first = await epi.put(`/api/districts/${district.id}/cases`).send({ diseaseId: dengue.id, year: w.year, week: w.week, cases: 5 });
    expect(first.status, JSON.stringify(first.body)).toBeLessThan(300);
    const again = await epi
      .put(`/api/districts/${district.id}/cases`)
      .send({ diseaseId: dengue.id, year: w.year, week: w.week, cases: 6, confirmed: null, probable: null, ageBands: null, reason: 'recounted' });
    expect(again.status, JSON.stringify(again.body)).toBeLessThan(300);
    expect((await epi.get(`/api/districts/${district.id}/cases?diseaseId=${dengue.id}&year=${w.year}`)).status).toBe(200);
    expect((await epi.get(`/api/cases/grid?diseaseId=${dengue.id}`)).status).toBe(200);

    // Weather: a station without elevation or active dates, rows without humidity, dew point or rain.
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const place = await makeDistrict(t.ds, { boundary: square(60, 10), centroidLat: 10.5, centroidLon: 60.5 });
    const station = await officer.post('/api/weather/stations').send({ code: 'OPT-ST-1', name: 'No elevation', latitude: 10.5, longitude: 60.5, activeFrom: null });
    expect(station.status).toBe(201);
    expect(station.body.elevation).toBeNull();
    const up = await officer
      .post('/api/weather/uploads?wait=true')
      .attach('file', Buffer.from(csv('station,date,tmin,tmax,rh,dewpoint,rain', [['OPT-ST-1', '2026-01-05', 10, 20, '', '', ''], ['OPT-ST-1', '2026-01-06', 11, 21, '', '', '']])), 'w.csv');
    expect(up.body).toMatchObject({ status: 'done', rowsAccepted: 2, rowsRejected: 0 });
    const before = await countRows(t.ds, 'weather_observation_revisions');
    const fix = await officer.put('/api/weather/observations').send({ station: 'OPT-ST-1', date: '2026-01-06', tmin: 12, tmax: 22, rh: null, dewpoint: null });
    expect(fix.status, JSON.stringify(fix.body)).toBe(200);
    expect((await countRows(t.ds, 'weather_observation_revisions')).weather_observation_revisions).toBe(before.weather_observation_revisions + 1);
    const days = await officer.get(`/api/weather/stations/${station.body.id}/days?from=2026-01-01&to=2026-01-31`);
    expect(days.status).toBe(200);
    expect(days.body.days.map((d: { rh: number | null; rain: number | null }) => [d.rh, d.rain])).toEqual([[null, null], [null, null]]);
    expect((await officer.get(`/api/weather/districts/${place.id}/series`)).status).toBe(200);
    expect((await officer.patch(`/api/weather/stations/${station.body.id}`).send({ elevation: null, activeTo: null })).status).toBe(200);

    const run = await runSeasonNow(t.ctx, { asOf: AS_OF });
    expect(run!.error).toBeNull();
    expect(run!.status).toBe('succeeded');
    expect((await officer.get(`/api/districts/${district.id}/file`)).status).toBe(200);
    expect((await officer.get(`/api/districts/${place.id}/file`)).status).toBe(200);
  });
});
