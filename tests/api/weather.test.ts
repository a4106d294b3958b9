import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent, square } from '../support/factories';
import { csv, dayAfter, makeStation, WEATHER_TABLES } from '../support/weather-factories';

let t: TestApp;
let officer: Awaited<ReturnType<typeof signedInAgent>>;
const HEADER = 'station,date,tmin,tmax,rh,rain';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
});
afterAll(() => t.close());

const upload = (body: string | Buffer, opts: { tempUnit?: string; rainUnit?: string; name?: string; agent?: typeof officer } = {}) =>
  (opts.agent ?? officer)
    .post('/api/weather/uploads?wait=true')
    .field('tempUnit', opts.tempUnit ?? 'C')
    .field('rainUnit', opts.rainUnit ?? 'mm')
    .attach('file', Buffer.isBuffer(body) ? body : Buffer.from(body), opts.name ?? 'weather.csv');

const observations = (stationId: string) =>
  t.ds.query(`SELECT to_char(date, 'YYYY-MM-DD') AS date, tmin, tmax, rh, rain, flags FROM weather_observations WHERE station_id = $1 ORDER BY date`, [stationId]);

/** A plain, plausible month of rows for a station. */
const month = (code: string, start = '2026-01-01', days = 30, base = 10) =>
  Array.from({ length: days }, (_, i) => [code, dayAfter(start, i), base + (i % 3), base + 9 + (i % 4), 60 + (i % 5), i % 2]);

describe('weather uploads', () => {
  it('when an officer uploads a file in °F and inches, then the rows are stored in SI and the district series is derived', async () => {
    const district = await makeDistrict(t.ds, { boundary: square(30, 10), centroidLat: 10.5, centroidLon: 30.5 });
    const station = await makeStation(t.ds, { latitude: 10.5, longitude: 30.5 });
    const res = await upload(csv(HEADER, [[station.code, '2026-02-01', 50, 86, 70, 1], [station.code, '2026-02-02', 41, 68, '', '']]), { tempUnit: 'F', rainUnit: 'in' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'done', rowsAccepted: 2, rowsRejected: 0, rowsProcessed: 2 });
    const rows = await observations(station.id);
    expect(rows[0]).toMatchObject({ date: '2026-02-01', tmin: 10, tmax: 30, rh: 70, rain: 25.4 });
    expect(rows[1]).toMatchObject({ tmin: 5, tmax: 20, rh: null, rain: null });
    const series = await officer.get(`/api/weather/districts/${district.id}/series`);
    expect(series.status).toBe(200);
    expect(series.body.source).toMatchObject({ kind: 'stations', stations: [{ code: station.code, weight: 1 }] });
    expect(series.body.days.map((d: { date: string; tmax: number }) => [d.date, d.tmax])).toEqual([['2026-02-01', 30], ['2026-02-02', 20]]);
  });

  it('when a station comes back later in the file, then all its rows are kept and each day names the upload', async () => {
    const a = await makeStation(t.ds, { latitude: 40.2, longitude: 40.2 });
    const b = await makeStation(t.ds, { latitude: 40.4, longitude: 40.4 });
    const rows = [...month(a.code, '2026-01-01', 10), ...month(b.code, '2026-01-01', 10), ...month(a.code, '2026-01-11', 10)];
    const res = await upload(csv(HEADER, rows));
    expect(res.body).toMatchObject({ status: 'done', rowsAccepted: 30, rowsRejected: 0 });
    const days = await t.ds.query('SELECT upload_id FROM weather_observations WHERE station_id = $1 ORDER BY date', [a.id]);
    expect(days).toHaveLength(20);
    for (const d of days) expect(d.upload_id).toBe(res.body.id);
  });

  it('when the same file is uploaded twice, then the second upload changes nothing', async () => {
    const station = await makeStation(t.ds, { latitude: 40, longitude: 40 });
    const file = csv(HEADER, month(station.code));
    expect((await upload(file)).body.rowsAccepted).toBe(30);
    const before = await countRows(t.ds, 'weather_observations', 'weather_observation_revisions');
    const snapshot = await t.ds.query('SELECT * FROM weather_observations WHERE station_id = $1 ORDER BY date', [station.id]);
    const again = await upload(file);
    expect(again.body).toMatchObject({ status: 'done', rowsAccepted: 30, rowsReplaced: 0 });
    expect(await countRows(t.ds, 'weather_observations', 'weather_observation_revisions')).toEqual(before);
    expect(await t.ds.query('SELECT * FROM weather_observations WHERE station_id = $1 ORDER BY date', [station.id])).toEqual(snapshot);
  });

  it('when a corrected row is uploaded, then it replaces the old value and the old one stays readable in the revisions', async () => {
    const station = await makeStation(t.ds, { latitude: 41, longitude: 41 });
    await upload(csv(HEADER, month(station.code)));
    const fix = await upload(csv(HEADER, [[station.code, '2026-01-05', 11.5, 21.5, 61, 0]]));
    expect(fix.body).toMatchObject({ rowsAccepted: 1, rowsReplaced: 1 });
    const row = (await observations(station.id)).find((r: { date: string }) => r.date === '2026-01-05');
    expect(row).toMatchObject({ tmin: 11.5, tmax: 21.5 });
    const revs = await officer.get(`/api/weather/stations/${station.id}/revisions?date=2026-01-05`);
    expect(revs.status).toBe(200);
    expect(revs.body.revisions).toHaveLength(1);
    expect(revs.body.revisions[0]).toMatchObject({ date: '2026-01-05', tmin: 11, tmax: 19, replacedByUploadId: fix.body.id });
    const days = await officer.get(`/api/weather/stations/${station.id}/days?from=2026-01-05&to=2026-01-05`);
    expect(days.body.days[0]).toMatchObject({ tmin: 11.5, revisions: 1 });
  });

  it('when rows break the rules, then each is rejected with row, column, value and reason and the good rows still load', async () => {
    const station = await makeStation(t.ds, { latitude: 42, longitude: 42 });
    const c = station.code;
    const file = csv(HEADER, [
      [c, '2026-03-01', 10, 20, 50, 0], // row 2: fine
      ['NO-SUCH', '2026-03-02', 10, 20, 50, 0], // 3 unknown station
      [c, '2026-02-30', 10, 20, 50, 0], // 4 not a date
      [c, '2026-03-03', 'ten', 20, 50, 0], // 5 not a number
      [c, '2026-03-04', 25, 20, 50, 0], // 6 Tmin > Tmax
      [c, '2026-03-05', 10, 75, 50, 0], // 7 beyond physical limits
      [c, '2026-03-06', 10, 20, 130, 0], // 8 RH > 100
      [c, '2026-03-07', 10, 20, 50, -4], // 9 negative rain
      [c, '2026-03-01', 11, 21, 50, 0], // 10 duplicate of row 2
      [c, '2099-01-01', 10, 20, 50, 0], // 11 in the future
    ]);
    const before = await countRows(t.ds, 'weather_observations');
    const res = await upload(file);
    expect(res.body).toMatchObject({ status: 'done', rowsProcessed: 10, rowsAccepted: 1, rowsRejected: 9 });
    expect((await countRows(t.ds, 'weather_observations')).weather_observations).toBe(before.weather_observations + 1);
    const report = await officer.get(`/api/weather/uploads/${res.body.id}/issues`);
    const byRow = Object.fromEntries(report.body.issues.map((i: { rowNumber: number; rule: string; column: string }) => [i.rowNumber, `${i.column}:${i.rule}`]));
    expect(byRow).toEqual({
      3: 'station:unknown-station', 4: 'date:bad-date', 5: 'tmin:bad-number', 6: 'tmin:tmin-above-tmax', 7: 'tmax:temp-limits',
      8: 'rh:rh-range', 9: 'rain:rain-limits', 10: '(row):duplicate-row', 11: 'date:future-date',
    });
    expect(report.body.issues.find((i: { rowNumber: number }) => i.rowNumber === 5)).toMatchObject({ value: 'ten', severity: 'rejected' });
    expect((await observations(station.id))[0]).toMatchObject({ date: '2026-03-01', tmin: 10 });
  });

  it('when values jump, repeat or disagree with the neighbours, then the rows are kept and flagged', async () => {
    const a = await makeStation(t.ds, { latitude: 50, longitude: 50, elevation: 100 });
    const b = await makeStation(t.ds, { latitude: 50.1, longitude: 50.1, elevation: 100 });
    const n = await makeStation(t.ds, { latitude: 50.05, longitude: 49.9, elevation: 100 });
    const rows: (string | number)[][] = [];
    for (let i = 0; i < 20; i++) {
      const d = dayAfter('2026-04-01', i);
      rows.push([b.code, d, 10 + (i % 3), 20 + (i % 2), 50, 0], [n.code, d, 10 + (i % 2), 20 + (i % 3), 50, 0]);
      // a: a jump on day 5, a stuck sensor from day 10 to 15, and a hot outlier on day 18
      const tmax = i === 5 ? 42 : i >= 10 && i <= 15 ? 19 : i === 18 ? 36 : 20 + (i % 2);
      const tmin = i >= 10 && i <= 15 ? 9 : 10 + (i % 3);
      rows.push([a.code, d, tmin, tmax, 50, 0]);
    }
    const res = await upload(csv(HEADER, rows));
    expect(res.body).toMatchObject({ status: 'done', rowsAccepted: 60, rowsRejected: 0 });
    const flagsOf = Object.fromEntries((await observations(a.id)).map((r: { date: string; flags: string[] }) => [r.date, r.flags]));
    expect(flagsOf['2026-04-06']).toEqual(expect.arrayContaining(['jump', 'spatial']));
    for (let i = 10; i <= 15; i++) expect(flagsOf[dayAfter('2026-04-01', i)]).toContain('run');
    expect(flagsOf['2026-04-19']).toContain('spatial');
    expect(flagsOf['2026-04-03']).toEqual([]);
    expect(res.body.rowsFlagged).toBeGreaterThanOrEqual(8);
    const report = await officer.get(`/api/weather/uploads/${res.body.id}/issues`);
    expect(report.body.issues.filter((i: { severity: string }) => i.severity === 'flagged').map((i: { rule: string }) => i.rule))
      .toEqual(expect.arrayContaining(['jump', 'run', 'spatial']));
  });

  it('when a station misses 2 days and then 6 days, then the short gap is filled and the long one stays missing in the district series', async () => {
    const district = await makeDistrict(t.ds, { boundary: square(60, 10), centroidLat: 10.5, centroidLon: 60.5 });
    const station = await makeStation(t.ds, { latitude: 10.5, longitude: 60.5 });
    const keep = [0, 1, 4, 5, 12, 13]; // gap of 2 (days 2–3), gap of 6 (days 6–11)
    await upload(csv(HEADER, keep.map((i) => [station.code, dayAfter('2026-05-01', i), 10 + i, 20 + i, 50, 1])));
    const series = await officer.get(`/api/weather/districts/${district.id}/series`);
    const days = series.body.days as { date: string; tmin: number | null; filled: boolean; missing: boolean }[];
    expect(days).toHaveLength(14);
    expect(days[2]).toMatchObject({ date: '2026-05-03', tmin: 12, filled: true, missing: false });
    expect(days[3]).toMatchObject({ tmin: 13, filled: true });
    for (let i = 6; i <= 11; i++) expect(days[i]).toMatchObject({ tmin: null, filled: false, missing: true });
    expect(series.body.summary).toMatchObject({ days: 14, filled: 2, missing: 6 });
  });

  it('when a district has no station, then its series is interpolated from the nearest stations, with distances and weights', async () => {
    const near = await makeStation(t.ds, { latitude: -30.5, longitude: -59.5 });
    const far = await makeStation(t.ds, { latitude: -31.5, longitude: -61.5 });
    const district = await makeDistrict(t.ds, { boundary: square(-61, -31), centroidLat: -30.5, centroidLon: -60.5 });
    await upload(csv(HEADER, [[near.code, '2026-06-01', 10, 20, '', ''], [far.code, '2026-06-01', 20, 30, '', '']]));
    const res = await officer.get(`/api/weather/districts/${district.id}/series`);
    expect(res.body.source.kind).toBe('interpolated');
    const [first, second] = res.body.source.stations;
    expect(first.code).toBe(near.code);
    expect(second.code).toBe(far.code);
    expect(first.weight).toBeGreaterThan(second.weight);
    expect(first.distanceKm).toBeGreaterThan(90);
    // Inverse-distance weights (Shepard 1968, power 2), renormalised over the stations reporting that day.
    expect(first.weight / second.weight).toBeCloseTo((second.distanceKm / first.distanceKm) ** 2, 1);
    const day = res.body.days.find((d: { date: string }) => d.date === '2026-06-01');
    expect(day.tmin).toBeCloseTo((first.weight * 10 + second.weight * 20) / (first.weight + second.weight), 1);
    expect(day.stationCount).toBe(2);
  });

  it('when a file is sent without waiting, then the answer says processing and polling the upload ends at done with the counts', async () => {
    const station = await makeStation(t.ds, { latitude: 43, longitude: 43 });
    const res = await officer.post('/api/weather/uploads').field('tempUnit', 'C').field('rainUnit', 'mm')
      .attach('file', Buffer.from(csv(HEADER, month(station.code))), 'month.csv');
    expect(res.status).toBe(201);
    expect(res.body.fileName).toBe('month.csv');
    let state = res.body;
    for (let i = 0; i < 100 && state.status === 'processing'; i++) {
      await new Promise((r) => setTimeout(r, 50));
      state = (await officer.get(`/api/weather/uploads/${res.body.id}`)).body;
    }
    expect(state).toMatchObject({ status: 'done', rowsAccepted: 30, rowsProcessed: 30 });
    const list = await officer.get('/api/weather/uploads');
    expect(list.body.uploads.map((u: { id: string }) => u.id)).toContain(res.body.id);
  });

  it('when the report is downloaded as CSV, then cells a spreadsheet would run as formulas are neutralised', async () => {
    const res = await upload(csv(HEADER, [['=HYPERLINK(1)', '2026-01-01', '@SUM(1)', '+1', '-2', '0']]));
    const file = await officer.get(`/api/weather/uploads/${res.body.id}/issues?format=csv`);
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toMatch(/text\/csv/);
    expect(file.headers['content-disposition']).toMatch(/attachment/);
    const lines = file.text.trim().split('\n');
    expect(lines[0]).toBe('row,station,date,column,value (°C; mm),outcome,rule,reason');
    expect(lines[1]).toMatch(/^2,'=HYPERLINK\(1\),2026-01-01,station,/);
    expect(file.text).toContain("'@SUM(1)");
    expect(file.text).not.toMatch(/,=|,@|,\+/);
  });
});

describe('bad files', () => {
  const cases: [string, string | Buffer, string, RegExp][] = [
    ['an empty file', '', 'empty_file', /empty/],
    ['a file with no header', 'X,2026-01-01,1,2\n', 'bad_header', /header/],
    ['the wrong columns', 'site,day,low,high\nA,2026-01-01,1,2\n', 'bad_header', /missing station, date, tmin, tmax/],
    ['a binary file', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0xff, 0xfe, 0x00, 0x10]), 'binary_file', /not a text CSV/],
    ['a header and no rows', 'station,date,tmin,tmax\n', 'no_rows', /no rows/],
  ];
  for (const [what, body, code, message] of cases) {
    it(`when the file is ${what}, then the upload is refused with 422 and its reason, the upload says refused, and nothing is written`, async () => {
      const before = await countRows(t.ds, ...WEATHER_TABLES);
      const res = await upload(body);
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe(code);
      expect(res.body.error.message).toMatch(message);
      expect(res.body.error.message).toMatch(/Nothing from it was saved/);
      const state = await officer.get(`/api/weather/uploads/${res.body.error.params.uploadId}`);
      expect(state.body).toMatchObject({ status: 'refused', reasonCode: code });
      expect(await countRows(t.ds, ...WEATHER_TABLES)).toEqual(before);
    });
  }

  it('when the file is cut off in the middle of a row, then the whole upload fails and none of its rows are kept', async () => {
    const station = await makeStation(t.ds, { latitude: 44, longitude: 44 });
    const whole = csv(HEADER, month(station.code));
    const before = await countRows(t.ds, ...WEATHER_TABLES);
    const res = await upload(whole.slice(0, whole.length - 12));
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: 'truncated_file', params: { line: 31 } });
    expect(res.body.error.message).toMatch(/cut off/);
    expect(await countRows(t.ds, ...WEATHER_TABLES)).toEqual(before);
    const quoted = await upload(`${HEADER}\n${station.code},2026-01-01,1,2,"5`);
    expect(quoted.body.error.message).toMatch(/cut off/);
    expect(await countRows(t.ds, ...WEATHER_TABLES)).toEqual(before);
  });

  it('when a value has a quote in the middle of a field, then that row is rejected naming the column and value, and the other rows load', async () => {
    const station = await makeStation(t.ds, { latitude: 44.5, longitude: 44.5 });
    const res = await upload(`${HEADER}\n${station.code},2026-01-01,1,2,50,0\n${station.code},2026-01-02,1 "x",2,50,0\n`);
    expect(res.body).toMatchObject({ status: 'done', rowsAccepted: 1, rowsRejected: 1 });
    const report = await officer.get(`/api/weather/uploads/${res.body.id}/issues`);
    expect(report.body.issues).toEqual([expect.objectContaining({ rowNumber: 3, column: 'tmin', value: '1 "x"', rule: 'bad-number' })]);
  });

  it('when a quoted value is closed and then followed by more text, then the upload fails as invalid CSV naming the line, and nothing is kept', async () => {
    const station = await makeStation(t.ds, { latitude: 44.6, longitude: 44.6 });
    const before = await countRows(t.ds, ...WEATHER_TABLES);
    const res = await upload(`${HEADER}\n${station.code},2026-01-01,1,2,50,0\n${station.code},2026-01-02,"1"x,2,50,0\n`);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: 'bad_csv', params: { line: 3 } });
    expect(res.body.error.message).toMatch(/not valid CSV near line 3.*Nothing from it was saved/);
    expect(await countRows(t.ds, ...WEATHER_TABLES)).toEqual(before);
  });

  it('when the file is over the size limit, then the answer is 413 naming the file and no upload is recorded', async () => {
    const small = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', WEATHER_UPLOAD_MAX_BYTES: '200' });
    try {
      const agent = await signedInAgent(small.app, (await makeUser(small.ds, { role: 'admin' })).email);
      const before = await countRows(small.ds, 'weather_uploads', ...WEATHER_TABLES);
      const res = await upload('station,date,tmin,tmax\n' + 'A,2026-01-01,1,2\n'.repeat(50), { agent });
      expect(res.status).toBe(413);
      expect(res.body.error).toMatchObject({ code: 'file_too_large' });
      expect(await countRows(small.ds, 'weather_uploads', ...WEATHER_TABLES)).toEqual(before);
    } finally {
      await small.close();
    }
  });

  it('when no file is attached or a unit is unknown, then the answer is 400 naming the field', async () => {
    const none = await officer.post('/api/weather/uploads').field('tempUnit', 'C');
    expect(none.status).toBe(400);
    expect(none.body.error.fields[0].path).toBe('file');
    const unit = await officer.post('/api/weather/uploads').field('tempUnit', 'K').attach('file', Buffer.from('x'), 'x.csv');
    expect(unit.status).toBe(400);
    expect(unit.body.error.fields[0].path).toBe('tempUnit');
  });

  it('when an upload\'s process stopped touching it, then reading it marks it failed', async () => {
    const stale = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', WEATHER_UPLOAD_STALE_SECONDS: '1' });
    try {
      const [{ id }] = await stale.ds.query(
        `INSERT INTO weather_uploads (source, status, temp_unit, rain_unit, heartbeat_at) VALUES ('upload', 'processing', 'C', 'mm', now() - interval '5 seconds') RETURNING id`,
      );
      const agent = await signedInAgent(stale.app, (await makeUser(stale.ds, { role: 'officer' })).email);
      const res = await agent.get(`/api/weather/uploads/${id}`);
      expect(res.body).toMatchObject({ status: 'failed' });
      expect(res.body.message).toMatch(/server stopped/);
    } finally {
      await stale.close();
    }
  });
});

describe('corrections, stations and reading', () => {
  it('when an officer corrects one day, then it goes through the same checks: a good value replaces, a bad one is 400 and changes nothing', async () => {
    const station = await makeStation(t.ds, { latitude: 45, longitude: 45 });
    await upload(csv(HEADER, month(station.code)));
    const ok = await officer.put('/api/weather/observations').send({ station: station.code, date: '2026-01-10', tmin: 3, tmax: 13, rh: 40 });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ source: 'correction', rowsAccepted: 1, rowsReplaced: 1 });
    const before = await countRows(t.ds, 'weather_observations', 'weather_observation_revisions');
    const bad = await officer.put('/api/weather/observations').send({ station: station.code, date: '2026-01-10', tmin: 30, tmax: 13 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('row_rejected');
    expect(bad.body.error.fields[0]).toMatchObject({ path: 'tmin' });
    expect(await countRows(t.ds, 'weather_observations', 'weather_observation_revisions')).toEqual(before);
  });

  it('when a correction is refused, then no upload, report line or audit event is recorded either', async () => {
    const station = await makeStation(t.ds, { latitude: 45.5, longitude: 45.5 });
    const before = await countRows(t.ds, 'weather_uploads', 'weather_upload_issues', ...WEATHER_TABLES);
    const bad = await officer.put('/api/weather/observations').send({ station: station.code, date: '2026-01-10', tmin: 30, tmax: 13 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('row_rejected');
    expect(await countRows(t.ds, 'weather_uploads', 'weather_upload_issues', ...WEATHER_TABLES)).toEqual(before);
  });

  it('when an officer adds a station inside a district, then it is assigned to it; moved out, the district falls back to interpolation', async () => {
    const district = await makeDistrict(t.ds, { boundary: square(70, 10), centroidLat: 10.5, centroidLon: 70.5 });
    const res = await officer.post('/api/weather/stations').send({ code: 'NEW-ST-1', name: 'New one', latitude: 10.4, longitude: 70.6, elevation: 12 });
    expect(res.status).toBe(201);
    expect(res.body.district).toMatchObject({ id: district.id });
    expect((await officer.post('/api/weather/stations').send({ code: 'NEW-ST-1', name: 'Twin', latitude: 1, longitude: 1 })).status).toBe(409);
    const moved = await officer.patch(`/api/weather/stations/${res.body.id}`).send({ latitude: 12.5 });
    expect(moved.body.district).toBeNull();
    const series = await officer.get(`/api/weather/districts/${district.id}/series`);
    expect(series.body.source.kind).toBe('interpolated');
    const audit = await countRows(t.ds, 'audit_events');
    expect(audit.audit_events).toBeGreaterThan(0);
  });

  it('when a community worker reads weather, then only their own district\'s series and stations are visible', async () => {
    const own = await makeDistrict(t.ds, { boundary: square(80, 10), centroidLat: 10.5, centroidLon: 80.5 });
    const other = await makeDistrict(t.ds, { boundary: square(82, 10), centroidLat: 10.5, centroidLon: 82.5 });
    const mine = await makeStation(t.ds, { latitude: 10.5, longitude: 80.5 });
    const theirs = await makeStation(t.ds, { latitude: 10.5, longitude: 82.5 });
    const worker = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [own.id] })).email);
    expect((await worker.get(`/api/weather/districts/${own.id}/series`)).status).toBe(200);
    expect((await worker.get(`/api/weather/districts/${other.id}/series`)).status).toBe(403);
    const stations = await worker.get('/api/weather/stations');
    expect(stations.body.stations.map((s: { id: string }) => s.id)).toEqual([mine.id]);
    expect((await worker.get(`/api/weather/stations/${theirs.id}/days`)).status).toBe(403);
    expect((await request(t.app).get('/api/weather/stations')).status).toBe(401);
  });
});

describe('feed', () => {
  it('when the feed is pulled, then the fake feed\'s rows go through the same checks into the database', async () => {
    const { buildDemoStations } = await import('../../sample/demo-stations');
    const demo = buildDemoStations().slice(0, 3);
    for (const s of demo) await makeStation(t.ds, { code: s.code, latitude: s.latitude, longitude: s.longitude, elevation: s.elevation });
    const feed = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', WEATHER_FEED_URL: process.env.TEST_FEED_URL!, WEATHER_FEED_KEY: process.env.TEST_FEED_KEY! });
    try {
      const agent = await signedInAgent(feed.app, (await makeUser(feed.ds, { role: 'admin' })).email);
      const res = await agent.post('/api/weather/feed/pull');
      expect(res.status).toBe(201);
      // The feed serves every demo station; those not set up here are rejected as unknown, like an upload's.
      expect(res.body).toMatchObject({ source: 'feed', status: 'done', rowsAccepted: 3 * 7 });
      expect(res.body.rowsRejected).toBeGreaterThan(0);
      const again = await agent.post('/api/weather/feed/pull');
      expect(again.body).toMatchObject({ status: 'done', rowsReplaced: 0 });
    } finally {
      await feed.close();
    }
    const wrongKey = await createTestApp({ WEATHER_FEED_URL: process.env.TEST_FEED_URL!, WEATHER_FEED_KEY: 'wrong' });
    try {
      const { WeatherFeedService } = await import('../../server/weather/weather-feed.service');
      const id = await new WeatherFeedService(wrongKey.ctx).pull(null);
      const [row] = await wrongKey.ds.query('SELECT status, message FROM weather_uploads WHERE id = $1', [id]);
      expect(row.status).toBe('failed');
      expect(row.message).toMatch(/HTTP 401/);
    } finally {
      await wrongKey.close();
    }
  });
});
