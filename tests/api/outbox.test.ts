import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BulletinsService } from '../../server/bulletins/bulletins.service';
import { createMailer, type Mailer } from '../../server/mail/mailer';
import { enqueueMail } from '../../server/outbox/outbox.repository';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, testConfig, type TestApp } from '../support/test-app';
import { makeUser, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';
import { caughtFor, header, makeFlag, waitForMails } from '../support/flags-factories';

let t: TestApp;
let live: Mailer;

beforeAll(async () => {
  // The app's own mailer points at a closed port: the mail server is "down" until a test uses `live`.
  t = await createTestApp({ SMTP_PORT: '9', SIGN_IN_LIMIT_PER_ADDRESS: '1000', OUTBOX_MAX_ATTEMPTS: '3' });
  live = createMailer(testConfig());
});
afterAll(async () => {
  live.close();
  await t.close();
});

const pendingIds = async () => (await t.ds.query(`SELECT id FROM outbox_messages WHERE status = 'pending'`)).map((r: { id: string }) => r.id);

describe('the outbox', () => {
  it('when the mail server is unreachable, then advisories and bulletins queue with attempts and back-off; when it returns, each is delivered exactly once', async () => {
    const district = await makeSeasonDistrict(t.ds, { warmth: 2 });
    await runSeasonNow(t.ctx, { asOf: '2026-08-20' });
    const worker = await makeUser(t.ds, { role: 'worker', districtIds: [district.id] });
    const flag = await makeFlag(t.ds, { districtId: district.id, reason: 'manual' });
    const sup = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
    expect((await sup.post(`/api/flags/${flag.id}/approve`).send({})).status).toBe(200);
    const week = await new BulletinsService(t.ctx).sendLocked();
    expect(week!.bulletinsWritten).toBe(1);

    const down = await new OutboxWorker(t.ctx).drain();
    expect(down.sent).toBe(0);
    expect(down.retry).toBeGreaterThanOrEqual(2);
    const rows = await t.ds.query(`SELECT kind, status, attempts, last_error, next_attempt_at > now() AS later FROM outbox_messages WHERE to_address = $1 ORDER BY kind`, [worker.email]);
    expect(rows).toEqual([
      { kind: 'advisory', status: 'pending', attempts: 1, last_error: expect.stringMatching(/ECONNREFUSED/), later: true },
      { kind: 'bulletin', status: 'pending', attempts: 1, last_error: expect.stringMatching(/ECONNREFUSED/), later: true },
    ]);
    const log = await t.ds.query(`SELECT outcome, error FROM outbox_attempts a JOIN outbox_messages m ON m.id = a.message_id WHERE m.to_address = $1`, [worker.email]);
    expect(log).toHaveLength(2);
    expect(log.every((l: { outcome: string }) => l.outcome === 'retry')).toBe(true);
    // Nothing is due before its back-off ends.
    expect(await new OutboxWorker(t.ctx, { mailer: live }).drain()).toEqual({ sent: 0, retry: 0, failed: 0 });

    // The server is back and the back-off has passed.
    await t.ds.query(`UPDATE outbox_messages SET next_attempt_at = now() WHERE status = 'pending'`);
    const queued = (await pendingIds()).length;
    const back = await new OutboxWorker(t.ctx, { mailer: live }).drain();
    expect(back).toEqual({ sent: queued, retry: 0, failed: 0 });
    const mails = await waitForMails([worker.email], 2);
    expect(mails.map((m) => m.subject).sort()).toEqual([expect.stringMatching(/^Broodcast advisory/), expect.stringMatching(/^Broodcast weekly bulletin/)]);
    expect(await pendingIds()).toEqual([]);
    expect(await new OutboxWorker(t.ctx, { mailer: live }).drain()).toEqual({ sent: 0, retry: 0, failed: 0 });
    await new Promise((r) => setTimeout(r, 300));
    expect(await caughtFor([worker.email])).toHaveLength(2);

    const log2 = await sup.get('/api/outbox?status=sent');
    expect(log2.status).toBe(200);
    const shown = log2.body.messages.find((m: { to: string; kind: string }) => m.to === worker.email && m.kind === 'advisory');
    expect(shown.log.map((l: { outcome: string }) => l.outcome)).toEqual(['retry', 'sent']);
  });

  it('when a worker stops in the middle of a batch and a new worker takes over, then every message is delivered exactly once', async () => {
    const people = await Promise.all(Array.from({ length: 6 }, (_, i) => makeUser(t.ds, { role: 'officer', email: `restart-${i}-${Date.now()}@test.example` })));
    const addresses = people.map((p) => p.email);
    await t.ds.transaction((m) => enqueueMail(m, t.ctx.config, addresses.map((to) => ({ kind: 'advisory' as const, to, subject: 'Restart drill', text: 'drill', html: '<p>drill</p>' }))));
    let n = 0;
    const first = new OutboxWorker(t.ctx, { mailer: { send: async (msg) => { await live.send(msg); if (++n === 3) first.stop(); }, close: () => undefined } });
    expect(await first.drain()).toMatchObject({ sent: 3 });
    const second = new OutboxWorker(t.ctx, { mailer: live });
    expect(await second.drain()).toMatchObject({ sent: 3 });
    const mails = await waitForMails(addresses, 6);
    expect(mails).toHaveLength(6);
    const ids = mails.map((m) => header(m, 'message-id'));
    expect(ids.every((id) => /^<[0-9a-f-]{36}@broodcast\.invalid>$/.test(id ?? '')), JSON.stringify(ids)).toBe(true);
    expect(new Set(ids).size).toBe(6);
    const rows = await t.ds.query(`SELECT status, attempts FROM outbox_messages WHERE to_address = ANY($1)`, [addresses]);
    expect(rows.every((r: { status: string; attempts: number }) => r.status === 'sent' && r.attempts === 1)).toBe(true);
  });

  it('when two workers drain at once, then no message is sent twice', async () => {
    const addresses = Array.from({ length: 8 }, (_, i) => `parallel-${i}-${Date.now()}@test.example`);
    await t.ds.transaction((m) => enqueueMail(m, t.ctx.config, addresses.map((to) => ({ kind: 'bulletin' as const, to, subject: 'Parallel drill', text: 'drill', html: '<p>drill</p>' }))));
    const [a, b] = await Promise.all([new OutboxWorker(t.ctx, { mailer: live }).drain(), new OutboxWorker(t.ctx, { mailer: live }).drain()]);
    expect(a.sent + b.sent).toBe(8);
    const mails = await waitForMails(addresses, 8);
    await new Promise((r) => setTimeout(r, 300));
    expect((await caughtFor(addresses)).length).toBe(8);
    expect(new Set(mails.map((m) => m.to[0].address)).size).toBe(8);
  });

  it('when a message keeps failing, then it is marked failed after the last attempt and the delivery log shows every attempt', async () => {
    const to = `always-down-${Date.now()}@test.example`;
    await t.ds.transaction((m) => enqueueMail(m, t.ctx.config, [{ kind: 'advisory', to, subject: 'Never arrives', text: 'x', html: '<p>x</p>' }]));
    for (let i = 0; i < 3; i++) {
      await t.ds.query(`UPDATE outbox_messages SET next_attempt_at = now() WHERE to_address = $1`, [to]);
      await new OutboxWorker(t.ctx).drain();
    }
    const [row] = await t.ds.query(`SELECT status, attempts FROM outbox_messages WHERE to_address = $1`, [to]);
    expect(row).toEqual({ status: 'failed', attempts: 3 });
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const res = await admin.get('/api/outbox?status=failed');
    const shown = res.body.messages.find((m: { to: string }) => m.to === to);
    expect(shown.log.map((l: { outcome: string }) => l.outcome)).toEqual(['retry', 'retry', 'failed']);
    expect(res.body.counts.failed).toBeGreaterThanOrEqual(1);
  });
});
