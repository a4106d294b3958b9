import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeDistrict, makeUser, signedInAgent, square } from '../support/factories';
import { dayAfter, makeStation } from '../support/weather-factories';

/**
 * The scheduled feed pull is a region-wide job: one station's broken rows must never stop the others.
 * A small feed of our own serves two good stations' week and, beside them, every shape of broken row a
 * real feed has been seen to send (a null, a bare string, nested objects, impossible dates, text in a number).
 */
let feed: Server;
let body: unknown = { rows: [] };
let t: TestApp;

beforeAll(async () => {
  feed = createServer((_req, res) => {
    res.writeHead(200, { 'content-type': 'application/json' });
    res.end(JSON.stringify(body));
  });
  await new Promise<void>((resolve) => feed.listen(0, '127.0.0.1', resolve));
  const { port } = feed.address() as AddressInfo;
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', WEATHER_FEED_URL: `http://127.0.0.1:${port}/stations.json` });
});
afterAll(async () => {
  await t.close();
  await new Promise((resolve) => feed.close(resolve));
});

const week = (station: string, start: string) =>
  Array.from({ length: 7 }, (_, i) => ({ station, date: dayAfter(start, i), tmin: 18 + (i % 3), tmax: 29 + (i % 2), rh: 70, rain: i % 2 }));

describe('the weather feed pull with one station\'s rows broken', () => {
  it('when one station in the feed sends broken rows, then the pull loads every other station\'s days, rejects only the broken rows with a reason, and both districts get their series', async () => {
    const north = await makeDistrict(t.ds, { boundary: square(60, 10), centroidLat: 10.5, centroidLon: 60.5 });
    const south = await makeDistrict(t.ds, { boundary: square(62, 10), centroidLat: 10.5, centroidLon: 62.5 });
    const broken = await makeDistrict(t.ds, { boundary: square(64, 10), centroidLat: 10.5, centroidLon: 64.5 });
    const a = await makeStation(t.ds, { latitude: 10.5, longitude: 60.5 });
    const b = await makeStation(t.ds, { latitude: 10.5, longitude: 62.5 });
    const c = await makeStation(t.ds, { latitude: 10.5, longitude: 64.5 });
    const bad: unknown[] = [
      null,
      'not a row',
      42,
      { station: c.code, date: '2026-02-30', tmin: 18, tmax: 29 },
      { station: c.code, date: '0099-06-15', tmin: 18, tmax: 29 },
      { station: c.code, date: '2026-03-02', tmin: 'warm', tmax: 29 },
      { station: c.code, date: '2026-03-03', tmin: { nested: [1, 2] }, tmax: 29 },
      { station: c.code, date: '2026-03-04', tmin: 35, tmax: 20 },
      { station: 'NO-SUCH-STATION', date: '2026-03-05', tmin: 18, tmax: 29 },
    ];
    body = { units: { temperature: 'C', rain: 'mm' }, rows: [...week(a.code, '2026-03-01'), ...bad, ...week(b.code, '2026-03-01')] };

    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const res = await admin.post('/api/weather/feed/pull');

    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ source: 'feed', status: 'done', rowsAccepted: 14, rowsRejected: bad.length });
    const days = await t.ds.query(
      `SELECT district_id, count(*)::int AS n FROM district_weather_days WHERE district_id = ANY($1) GROUP BY district_id`,
      [[north.id, south.id, broken.id]],
    );
    const byDistrict = Object.fromEntries(days.map((d: { district_id: string; n: number }) => [d.district_id, d.n]));
    expect(byDistrict[north.id]).toBeGreaterThanOrEqual(7);
    expect(byDistrict[south.id]).toBeGreaterThanOrEqual(7);
    const report = await admin.get(`/api/weather/uploads/${res.body.id}/issues`);
    expect(report.status).toBe(200);
    const rejected = report.body.issues.filter((i: { severity: string }) => i.severity === 'rejected');
    // Every broken row is named in the report with a rule, so a person can see what to fix.
    expect(new Set(rejected.map((i: { rowNumber: number }) => i.rowNumber)).size).toBe(bad.length);
    for (const issue of rejected) expect(issue.rule).toMatch(/\S/);
  });

  it('when the feed answers something that is not a list of rows, then the pull is recorded as failed and writes no weather', async () => {
    const before = await t.ds.query('SELECT count(*)::int AS n FROM weather_observations');
    body = { rows: { station: 'X' } };
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const res = await admin.post('/api/weather/feed/pull');
    expect(res.status).toBeLessThan(500);
    const [upload] = await t.ds.query(`SELECT status FROM weather_uploads WHERE source = 'feed' ORDER BY created_at DESC LIMIT 1`);
    expect(upload.status).toBe('failed');
    const after = await t.ds.query('SELECT count(*)::int AS n FROM weather_observations');
    expect(after[0].n).toBe(before[0].n);
  });
});
