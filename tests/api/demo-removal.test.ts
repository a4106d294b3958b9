import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../sample/demo-region';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, signedInAgent } from '../support/factories';

// Issue 17 item 4: an admin removes the demo region from a running installation, in one transaction, audited.
let t: TestApp;
let realDistrict: { id: string; code: string };

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  await seedDemoIfEmpty(t.ds, { nodeEnv: 'test', bcryptCost: 4 });
  realDistrict = await makeDistrict(t.ds, { code: 'REAL-01', name: 'A real district' });
  await runSeasonNow(t.ctx);
}, 240_000);
afterAll(() => t.close());

describe('removing the demo', () => {
  it('when a non-admin asks, or the confirmation or reason is missing, then it is refused and nothing is removed', async () => {
    const before = await countRows(t.ds, 'districts', 'users', 'audit_events');
    const officer = await signedInAgent(t.app, 'officer@halvern.example', DEMO_PASSWORD);
    expect((await officer.post('/api/demo/remove').send({ confirm: true, reason: 'x' })).status).toBe(403);
    const admin = await signedInAgent(t.app, 'admin@halvern.example', DEMO_PASSWORD);
    const noConfirm = await admin.post('/api/demo/remove').send({ reason: 'setting up the country' });
    expect(noConfirm.status).toBe(400);
    expect(noConfirm.body.error.fields).toEqual([expect.objectContaining({ path: 'confirm' })]);
    const noReason = await admin.post('/api/demo/remove').send({ confirm: true, reason: ' ' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toEqual([expect.objectContaining({ path: 'reason' })]);
    expect(await countRows(t.ds, 'districts', 'users', 'audit_events')).toEqual(before);
  });

  it('when the admin confirms, then every demo district and station and their data go, the demo people are deactivated (not the admin), real districts stay, and it is audited', async () => {
    const admin = await signedInAgent(t.app, 'admin@halvern.example', DEMO_PASSWORD);
    const summary = await admin.get('/api/demo');
    expect(summary.body).toEqual({ districts: 12, stations: expect.any(Number), users: 5 });
    expect(summary.body.stations).toBeGreaterThan(0);
    const [tiersBefore] = await t.ds.query(`SELECT count(*)::int AS n FROM district_tiers`);
    expect(tiersBefore.n).toBeGreaterThan(0);
    const officer = await signedInAgent(t.app, 'officer@halvern.example', DEMO_PASSWORD);

    const res = await admin.post('/api/demo/remove').send({ confirm: true, reason: 'setting up the country' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ districts: 12, stations: summary.body.stations, usersDeactivated: 4 });

    expect(await t.ds.query(`SELECT code FROM districts`)).toEqual([{ code: realDistrict.code }]);
    const [left] = await t.ds.query(
      `SELECT (SELECT count(*)::int FROM weather_stations WHERE is_demo) AS stations,
              (SELECT count(*)::int FROM district_tiers t JOIN districts d ON d.id = t.district_id WHERE d.is_demo) AS tiers,
              (SELECT count(*)::int FROM district_tiers) AS all_tiers`);
    expect(left).toMatchObject({ stations: 0, tiers: 0 });
    expect(left.all_tiers).toBeLessThan(tiersBefore.n);
    // The demo officer's session ended; the admin who removed it still works.
    expect((await officer.get('/api/me')).status).toBe(401);
    expect((await admin.get('/api/me')).status).toBe(200);
    const board = await admin.get('/api/board');
    expect(board.body.rows.map((r: { code: string }) => r.code)).toEqual([realDistrict.code]);
    expect(board.body.rows.every((r: { isDemo: boolean }) => !r.isDemo)).toBe(true);
    const [event] = await t.ds.query(`SELECT action, reason, before FROM audit_events WHERE action = 'demo.removed'`);
    expect(event.reason).toBe('setting up the country');
    expect(event.before.districts).toHaveLength(12);

    // Nothing left: a second removal says so.
    const again = await admin.post('/api/demo/remove').send({ confirm: true, reason: 'again' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('no_demo_data');
    // Only the admin who removed it is still an active demo account.
    expect((await admin.get('/api/demo')).body).toEqual({ districts: 0, stations: 0, users: 1 });
  });
});
