import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runSeasonNow, SeasonRunService } from '../../server/season/season-run.service';
import { tierRank } from '../../shared/tier';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent, square } from '../support/factories';
import { csv, dayAfter, makeStation } from '../support/weather-factories';

/**
 * Issue 16, items 1 and 2: plausibility before the model (held rows) and hand corrections win (conflicts).
 * The held rule is the modified z-score on the median absolute deviation, |Mi| > 3.5 (Iglewicz & Hoaglin
 * 1993, "How to Detect and Handle Outliers", ASQC Basic References in Quality Control vol. 16), applied as a
 * climatological check of each station against its own history for the time of year, as WMO guidance on
 * quality control of surface observations describes (WMO-No. 488, Guide to the Global Observing System;
 * WMO-No. 8). The °F reading is (F − 32) × 5/9 (definition of the Fahrenheit scale).
 */
let feed: Server;
let feedBody: unknown = { rows: [] };
let t: TestApp;
let officer: Awaited<ReturnType<typeof signedInAgent>>;
const HEADER = 'station,date,tmin,tmax,rh,rain';

beforeAll(async () => {
  feed = createServer((_req, res) => {
    res.writeHead(200, { 'content-type': 'application/json' });
    res.end(JSON.stringify(feedBody));
  });
  await new Promise<void>((resolve) => feed.listen(0, '127.0.0.1', resolve));
  const { port } = feed.address() as AddressInfo;
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', WEATHER_FEED_URL: `http://127.0.0.1:${port}/stations.json` });
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
});
afterAll(async () => {
  await t.close();
  await new Promise((resolve) => feed.close(resolve));
});

const upload = (body: string, tempUnit = 'C') =>
  officer.post('/api/weather/uploads?wait=true').field('tempUnit', tempUnit).field('rainUnit', 'mm').attach('file', Buffer.from(body), 'weather.csv');

const doy = (iso: string) => (Date.parse(iso) - Date.parse(`${iso.slice(0, 4)}-01-01`)) / 86_400_000;
/**
 * A cold upland station's invented climate (°C): Tmin −5 + 10 sin(2π(doy − 110)/365) with a small
 * deterministic wobble, Tmax 8 °C above. In November Tmin is about −8 °C and Tmax about 0 °C.
 */
const climate = (iso: string, i: number) => {
  const tmin = Math.round((-5 + 10 * Math.sin((2 * Math.PI * (doy(iso) - 110)) / 365) + ((i * 7) % 5) - 2) * 10) / 10;
  return { tmin, tmax: Math.round((tmin + 8 + ((i * 3) % 3)) * 10) / 10 };
};
const toF = (c: number) => Math.round((c * 9 / 5 + 32) * 10) / 10;

describe('plausibility before the model', () => {
  it('when a °C upload carries °F values, then the rows are held, counted and named, the tier is unchanged with a warning on the run, and they count only after confirmation', async () => {
    const district = await makeDistrict(t.ds, { boundary: square(70, 45), centroidLat: 45.5, centroidLon: 70.5 });
    await t.ds.query(`INSERT INTO district_profiles (district_id, profile_id, biofix) VALUES ($1, 'aedes-aegypti-dengue', NULL)`, [district.id]);
    const station = await makeStation(t.ds, { latitude: 45.5, longitude: 70.5, elevation: 973 });
    // Four years of history, all plausible (the first upload has nothing to compare with, so nothing is held).
    const history: (string | number)[][] = [];
    for (let i = 0, d = '2023-01-01'; d <= '2026-10-31'; i++, d = dayAfter('2023-01-01', i)) {
      const { tmin, tmax } = climate(d, i);
      history.push([station.code, d, tmin, tmax, 70, 1]);
    }
    const first = await upload(csv(HEADER, history));
    expect(first.body).toMatchObject({ status: 'done', rowsAccepted: history.length, rowsHeld: 0 });

    const AS_OF = '2026-11-20';
    await runSeasonNow(t.ctx, { asOf: AS_OF });
    const tierOf = async () => (await t.ds.query('SELECT tier, score FROM district_tiers WHERE district_id = $1', [district.id]))[0];
    const before = await tierOf();

    // November's cold days typed in °F in a file declared °C: 17–34 "°C" would be warm days for the mosquito.
    const november = Array.from({ length: 20 }, (_, k) => {
      const d = dayAfter('2026-11-01', k);
      const { tmin, tmax } = climate(d, 10_000 + k);
      return [station.code, d, toF(tmin), toF(tmax), 70, 1];
    });
    const res = await upload(csv(HEADER, november));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'done', rowsAccepted: 20, rowsHeld: 20 });

    // The row report: one held line per implausible value, named looks_fahrenheit, with its figures and the stored row.
    const report = await officer.get(`/api/weather/uploads/${res.body.id}/issues`);
    const held = report.body.issues.filter((i: { severity: string }) => i.severity === 'held');
    expect(held.length).toBeGreaterThanOrEqual(20);
    for (const line of held) {
      expect(line.rule).toBe('looks_fahrenheit');
      expect(line.params).toMatchObject({ basis: 'station' });
      expect(Math.abs(line.params.z)).toBeGreaterThan(3.5);
      expect(line.params.alternative).toBeLessThan(5); // read as °F the value is a cold November day
      expect(line.stored).toMatchObject({ held: true, rh: 70, rain: 1 });
    }
    const listed = await officer.get('/api/weather/held');
    expect(listed.status).toBe(200);
    expect(listed.body.total).toBe(20);
    expect(listed.body.held[0].reasons[0].rule).toBe('looks_fahrenheit');

    // Left out of the district series (the gap is too long to fill), so out of the model and the tier.
    const series = await officer.get(`/api/weather/districts/${district.id}/series?from=2026-11-01&to=2026-11-20`);
    expect(series.body.days.every((d: { tmax: number | null }) => d.tmax === null || d.tmax < 5)).toBe(true);
    const run = await new SeasonRunService(t.ctx).runLocked({ kind: 'manual', full: true, asOf: AS_OF });
    expect(run!.warnings).toContainEqual(expect.objectContaining({ code: 'weather_held', params: { count: 20, stations: station.code } }));
    expect(await tierOf()).toEqual(before);

    // Refused confirmations write nothing: no reason, a day that is not held.
    const audits = await countRows(t.ds, 'audit_events');
    const noReason = await officer.post('/api/weather/observations/confirm').send({ station: station.code, date: '2026-11-01' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.map((f: { path: string }) => f.path)).toContain('reason');
    const notHeld = await officer.post('/api/weather/observations/confirm').send({ station: station.code, date: '2026-10-01', reason: 'checked' });
    expect(notHeld.status).toBe(400);
    expect(notHeld.body.error).toMatchObject({ code: 'not_held', fields: [{ path: 'date' }] });
    expect(await countRows(t.ds, 'audit_events')).toEqual(audits);

    // A person confirms them (here: says the warm values are true) — only then do they count.
    for (const [, date] of november) {
      const ok = await officer.post('/api/weather/observations/confirm').send({ station: station.code, date, reason: 'Checked with the observer' });
      expect(ok.status).toBe(200);
      expect(ok.body.districtsRecomputed).toBe(1);
    }
    expect((await officer.get('/api/weather/held')).body.total).toBe(0);
    const after = await officer.get(`/api/weather/districts/${district.id}/series?from=2026-11-01&to=2026-11-20`);
    expect(after.body.days).toHaveLength(20);
    expect(after.body.days.every((d: { tmax: number }) => d.tmax > 25)).toBe(true);
    const rerun = await new SeasonRunService(t.ctx).runLocked({ kind: 'nightly', asOf: AS_OF });
    expect(rerun!.districtsDone).toBeGreaterThanOrEqual(1);
    expect(rerun!.warnings.some((w) => w.code === 'weather_held')).toBe(false);
    const confirmed = await tierOf();
    expect(confirmed.score).toBeGreaterThan(before.score);
    expect(tierRank(confirmed.tier)).toBeGreaterThan(tierRank(before.tier));
    // A later pull of the same values does not hold the confirmed days again.
    const again = await upload(csv(HEADER, november));
    expect(again.body).toMatchObject({ status: 'done', rowsHeld: 0 });
  });

  it('when a held day is corrected, then the correction releases it and the report\'s stored values pre-fill every column', async () => {
    const station = await makeStation(t.ds, { latitude: 44.5, longitude: 80.5, elevation: 500 });
    const history: (string | number)[][] = [];
    for (let i = 0, d = '2025-01-01'; d <= '2026-06-30'; i++, d = dayAfter('2025-01-01', i)) {
      const { tmin, tmax } = climate(d, i);
      history.push([station.code, d, tmin, tmax, 65, 2]);
    }
    await upload(csv(HEADER, history));
    // A typing slip: Tmax 40 °C on a day whose history says about 16 °C; RH and rain are fine.
    const slip = await upload(csv(HEADER, [[station.code, '2026-07-01', 6.5, 40, 55, 3.2]]));
    expect(slip.body).toMatchObject({ rowsHeld: 1 });
    const report = await officer.get(`/api/weather/uploads/${slip.body.id}/issues`);
    const [line] = report.body.issues;
    expect(line).toMatchObject({ severity: 'held', rule: 'unlike_station_history', column: 'tmax', stored: { tmin: 6.5, tmax: 40, rh: 55, rain: 3.2, held: true } });
    const fix = await officer.put('/api/weather/observations').send({ station: station.code, date: '2026-07-01', tmin: 6.5, tmax: 15, rh: 55, rain: 3.2 });
    expect(fix.status).toBe(200);
    const [day] = await t.ds.query(`SELECT tmax, flags FROM weather_observations WHERE station_id = $1 AND date = '2026-07-01'`, [station.id]);
    expect(day).toEqual({ tmax: 15, flags: [] });
  });
});

describe('hand corrections win', () => {
  it('when the feed brings other values for a day corrected by hand, then the correction stands, a conflict is listed, and keep or take resolves it', async () => {
    const station = await makeStation(t.ds, { latitude: 12.5, longitude: 90.5 });
    const week = (tmax: number) => Array.from({ length: 7 }, (_, i) => ({ station: station.code, date: dayAfter('2026-04-01', i), tmin: 20, tmax: tmax + (i % 2), rh: 70, rain: 1 }));
    feedBody = { units: { temperature: 'C', rain: 'mm' }, rows: week(30) };
    expect((await officer.post('/api/weather/feed/pull')).status).toBe(201);
    const fix = await officer.put('/api/weather/observations').send({ station: station.code, date: '2026-04-03', tmin: 19, tmax: 28, rh: 72, rain: 4 });
    expect(fix.status).toBe(200);

    // The feed now sends revised values for the whole week, the corrected day included.
    feedBody = { units: { temperature: 'C', rain: 'mm' }, rows: week(31) };
    const pulled = await officer.post('/api/weather/feed/pull');
    expect(pulled.body).toMatchObject({ status: 'done', rowsConflicting: 1, rowsAccepted: 6 });
    const dayOf = async (date: string) =>
      (await t.ds.query(`SELECT tmin, tmax, rh, rain FROM weather_observations WHERE station_id = $1 AND date = $2`, [station.id, date]))[0];
    expect(await dayOf('2026-04-03')).toEqual({ tmin: 19, tmax: 28, rh: 72, rain: 4 });
    expect(await dayOf('2026-04-04')).toMatchObject({ tmax: 32 });
    // An upload is held to the same rule.
    const up = await upload(csv(HEADER, [[station.code, '2026-04-03', 21, 33, 70, 0]]));
    expect(up.body).toMatchObject({ rowsConflicting: 1 });
    expect(await dayOf('2026-04-03')).toEqual({ tmin: 19, tmax: 28, rh: 72, rain: 4 });

    const listed = await officer.get('/api/weather/conflicts');
    expect(listed.status).toBe(200);
    const mine = listed.body.conflicts.filter((c: { station: string }) => c.station === station.code);
    expect(mine).toHaveLength(1); // the newer value replaced the older open one
    expect(mine[0]).toMatchObject({ date: '2026-04-03', current: { tmin: 19, tmax: 28, rh: 72, rain: 4 }, incoming: { tmin: 21, tmax: 33, rh: 70, rain: 0 }, source: 'upload' });

    // Bad input writes nothing.
    const rows = await countRows(t.ds, 'audit_events', 'weather_observation_revisions');
    const bad = await officer.post(`/api/weather/conflicts/${mine[0].id}/resolve`).send({ choice: 'maybe', reason: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path)).toContain('choice');
    expect((await officer.post('/api/weather/conflicts/999999999/resolve').send({ choice: 'keep', reason: 'x' })).status).toBe(404);
    expect(await countRows(t.ds, 'audit_events', 'weather_observation_revisions')).toEqual(rows);

    // Keep: the correction stays; the next pull of the same week lists the conflict again (the correction still wins).
    const kept = await officer.post(`/api/weather/conflicts/${mine[0].id}/resolve`).send({ choice: 'keep', reason: 'The observer confirmed 28' });
    expect(kept.status).toBe(200);
    expect((await officer.post(`/api/weather/conflicts/${mine[0].id}/resolve`).send({ choice: 'take', reason: 'again' })).status).toBe(409);
    expect(await dayOf('2026-04-03')).toEqual({ tmin: 19, tmax: 28, rh: 72, rain: 4 });
    await officer.post('/api/weather/feed/pull');
    const open = (await officer.get('/api/weather/conflicts')).body.conflicts.filter((c: { station: string }) => c.station === station.code);
    expect(open).toHaveLength(1);
    expect(open[0]).toMatchObject({ incoming: { tmax: 31 }, source: 'feed' });

    // Take: the feed's value replaces the correction, which stays readable in the revisions.
    const taken = await officer.post(`/api/weather/conflicts/${open[0].id}/resolve`).send({ choice: 'take', reason: 'The feed was revised at the source' });
    expect(taken.status).toBe(200);
    expect(await dayOf('2026-04-03')).toEqual({ tmin: 20, tmax: 31, rh: 70, rain: 1 });
    const revisions = await officer.get(`/api/weather/stations/${station.id}/revisions?date=2026-04-03`);
    expect(revisions.body.revisions[0]).toMatchObject({ tmin: 19, tmax: 28, reason: 'The feed was revised at the source' });
    expect((await officer.get('/api/weather/conflicts')).body.conflicts.filter((c: { station: string }) => c.station === station.code)).toHaveLength(0);
  });
});
