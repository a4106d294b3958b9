import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SEASON_RUN_LOCK, SeasonRunService, runSeasonNow } from '../../server/season/season-run.service';
import { lockKey } from '../../jobs/advisory-lock';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeUser, signedInAgent } from '../support/factories';
import { makeCaseHistory, makeSeasonDistrict } from '../support/season-factories';

let t: TestApp;
let warm: { id: string };
let cool: { id: string };
const AS_OF = '2026-08-20';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  warm = await makeSeasonDistrict(t.ds, { warmth: 2 });
  cool = await makeSeasonDistrict(t.ds, { lat: 33, profileId: 'culex-wnv', warmth: -12 });
  // Cases well above the prior seasons' level in the warm district (epi week 33 of 2026 is the as-of week).
  await makeCaseHistory(t.ds, warm.id, { base: 2, year: 2026, current: Array.from({ length: 33 }, (_, i) => (i > 28 ? 30 + i : 3)) });
});
afterAll(() => t.close());

describe('the season run', () => {
  it('when a full run is made, then each district gets its daily vector clock and a tier explained by its drivers', async () => {
    const run = await runSeasonNow(t.ctx, { asOf: AS_OF });
    expect(run!.error).toBeNull();
    expect(run!.status).toBe('succeeded');
    expect(run!.districtsDone).toBe(2);
    const days = await t.ds.query(`SELECT coalesce(sum(days), 0)::int AS n FROM vector_clock_seasons WHERE district_id = $1`, [warm.id]);
    expect(days[0].n).toBe(232); // 2026-01-01 … 2026-08-20
    const [tier] = await t.ds.query(`SELECT * FROM district_tiers WHERE district_id = $1`, [warm.id]);
    expect(tier.epi_week).toBe(33);
    expect(tier.drivers.map((d: { id: string }) => d.id)).toEqual(['climate', 'vectorClock', 'larval', 'cases']);
    expect(tier.channel_zone).toBe('above');
    const [coolTier] = await t.ds.query(`SELECT * FROM district_tiers WHERE district_id = $1`, [cool.id]);
    // The warm district with rising cases ranks above the cold one.
    expect(tier.score).toBeGreaterThan(coolTier.score);
  });

  it('when nothing changed, then the next run skips every district; when one district changes, only it is recomputed', async () => {
    const idle = await new SeasonRunService(t.ctx).runLocked({ kind: 'nightly', asOf: AS_OF });
    expect(idle!.districtsDone).toBe(0);
    expect(idle!.districtsSkipped).toBe(2);
    await t.ds.query(`UPDATE district_weather_days SET tmax = tmax + 1 WHERE district_id = $1 AND date = '2026-08-01'`, [cool.id]);
    const one = await new SeasonRunService(t.ctx).runLocked({ kind: 'nightly', asOf: AS_OF });
    expect(one!.districtsDone).toBe(1);
  });

  it('when another process holds the run lock, then a second run does not start and the API answers 409', async () => {
    const other = await createTestApp();
    const runner = other.ds.createQueryRunner();
    await runner.connect();
    await runner.query('SELECT pg_advisory_lock($1::bigint)', [lockKey(SEASON_RUN_LOCK)]);
    try {
      expect(await new SeasonRunService(t.ctx).runLocked({ kind: 'nightly', asOf: AS_OF })).toBeNull();
      const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
      const res = await officer.post('/api/season-runs').send({});
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('run_in_progress');
    } finally {
      await runner.query('SELECT pg_advisory_unlock($1::bigint)', [lockKey(SEASON_RUN_LOCK)]);
      await runner.release();
      await other.close();
    }
  });

  it('when a run dies part-way, then it is marked failed, finished districts keep whole results, and the next run completes the rest', async () => {
    await t.ds.query(`DELETE FROM district_run_state`);
    const before = await countRows(t.ds, 'vector_clock_seasons');
    const failed = await new SeasonRunService(t.ctx).runLocked({ kind: 'manual', asOf: AS_OF, failAfter: 1 });
    expect(failed!.status).toBe('failed');
    expect(failed!.districtsDone).toBe(1);
    expect(await countRows(t.ds, 'vector_clock_seasons')).toEqual(before); // replaced whole, never half
    const next = await new SeasonRunService(t.ctx).runLocked({ kind: 'nightly', asOf: AS_OF });
    expect(next!.status).toBe('succeeded');
    expect(next!.districtsDone).toBe(1);
  });

  it('when a run was left running by a killed process, then the next run marks it failed', async () => {
    const [ghost] = await t.ds.query(
      `INSERT INTO season_runs (kind, "full", status, started_at, as_of) VALUES ('nightly', false, 'running', now(), $1) RETURNING id`, [AS_OF]);
    await new SeasonRunService(t.ctx).runLocked({ kind: 'nightly', asOf: AS_OF });
    const [row] = await t.ds.query(`SELECT status, error FROM season_runs WHERE id = $1`, [ghost.id]);
    expect(row.status).toBe('failed');
    expect(row.error).toBe('interrupted');
  });
});

describe('the board', () => {
  it('when the board is asked for, then districts come ranked with tier, leading driver and cases; a worker sees only theirs', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const res = await officer.get('/api/board');
    expect(res.status).toBe(200);
    const ids = res.body.rows.map((r: { districtId: string }) => r.districtId);
    expect(ids.indexOf(warm.id)).toBeLessThan(ids.indexOf(cool.id));
    const top = res.body.rows.find((r: { districtId: string }) => r.districtId === warm.id);
    expect(top).toMatchObject({ channelZone: 'above', confidence: expect.any(String), leadingDriver: expect.any(String) });
    const worker = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [cool.id] })).email);
    const mine = await worker.get('/api/board');
    expect(mine.body.rows.map((r: { districtId: string }) => r.districtId)).toEqual([cool.id]);
  });

  it('when the client accepts gzip, then the board comes compressed with an ETag, and the same ETag again gets a 304', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const plain = await officer.get('/api/board').set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    const zipped = await officer.get('/api/board').set('Accept-Encoding', 'gzip, deflate, br');
    expect(zipped.status).toBe(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.headers.vary).toMatch(/Accept-Encoding/);
    expect(zipped.body).toEqual(plain.body); // supertest inflates it
    const etag = zipped.headers.etag;
    expect(etag).toMatch(/^W\/"board-/);
    const again = await officer.get('/api/board').set('If-None-Match', etag);
    expect(again.status).toBe(304);
  });

  it('when a new run lands, then the cached board changes with it', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const first = (await officer.get('/api/board')).body.computedAt;
    await runSeasonNow(t.ctx, { asOf: AS_OF });
    const second = (await officer.get('/api/board')).body.computedAt;
    expect(second).not.toBe(first);
  });

  it('when the District file is asked for, then weather, vector clock, cases with channel and tiers come in one answer', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const res = await officer.get(`/api/districts/${warm.id}/file?season=2026`);
    expect(res.status).toBe(200);
    expect(res.body.weather.dates.length).toBe(243);
    expect(res.body.vectorClock[0].profileId).toBe('aedes-aegypti-dengue');
    expect(res.body.cases[0].channel.upper.filter((x: number | null) => x !== null).length).toBeGreaterThan(40);
    expect(res.body.tiers[0].drivers).toHaveLength(4);
    const worker = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [cool.id] })).email);
    expect((await worker.get(`/api/districts/${warm.id}/file`)).status).toBe(403);
  });

  it('when an earlier season that no run stored is asked for (to compare heat with it), then its vector clock is computed from that year’s weather', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const stored = await t.ds.query('SELECT count(*)::int AS n FROM vector_clock_seasons WHERE district_id = $1 AND season_year = 2025', [warm.id]);
    expect(stored[0].n).toBe(0);
    const res = await officer.get(`/api/districts/${warm.id}/file?season=2025`);
    expect(res.status).toBe(200);
    expect(res.body.seasonYear).toBe(2025);
    expect(res.body.vectorClock).toHaveLength(1);
    const vc = res.body.vectorClock[0];
    expect(vc.profileId).toBe('aedes-aegypti-dengue');
    expect(vc.dates).toHaveLength(365);
    expect(vc.dates[0]).toBe('2025-01-01');
    // Degree-days only accumulate: the last day holds the most.
    expect(vc.cumulativeDegreeDays.at(-1)).toBeGreaterThan(1000);
    expect(vc.cumulativeDegreeDays.at(-1)).toBeGreaterThanOrEqual(vc.cumulativeDegreeDays[180]);
    // Computing it wrote nothing.
    const after = await t.ds.query('SELECT count(*)::int AS n FROM vector_clock_seasons WHERE district_id = $1 AND season_year = 2025', [warm.id]);
    expect(after[0].n).toBe(0);
  });
});

describe('tier settings', () => {
  it('when an admin changes the weights with a reason, then the new version is in force and audited; bad settings are refused whole', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const current = (await admin.get('/api/tier-settings')).body.settings;
    const before = await countRows(t.ds, 'tier_settings_versions', 'audit_events');
    const bad = await admin.put('/api/tier-settings').send({ settings: { ...current, cuts: { raised: 0.6, high: 0.5, critical: 0.7 } }, reason: 'try' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('settings.cuts');
    const noReason = await admin.put('/api/tier-settings').send({ settings: current });
    expect(noReason.body.error.fields[0].path).toBe('reason');
    expect(await countRows(t.ds, 'tier_settings_versions', 'audit_events')).toEqual(before);
    const ok = await admin.put('/api/tier-settings').send({ settings: { ...current, weights: { ...current.weights, larval: 0.3 } }, reason: 'Survey coverage is good this year' });
    expect(ok.status).toBe(200);
    expect((await admin.get('/api/tier-settings')).body.settings.weights.larval).toBe(0.3);
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    expect((await request(t.app).get('/api/tier-settings')).status).toBe(401);
    expect((await officer.put('/api/tier-settings').send({})).status).toBe(403);
  });
});
