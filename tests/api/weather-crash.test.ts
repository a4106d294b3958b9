import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { countRows, makeUser, signedInAgent, TEST_PASSWORD } from '../support/factories';
import { createTestApp, TEST_JWT_SECRET, type TestApp } from '../support/test-app';

let t: TestApp;
const uploadDir = mkdtempSync(path.join(os.tmpdir(), 'broodcast-crash-'));
beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
});
afterAll(async () => {
  await t.close();
  rmSync(uploadDir, { recursive: true, force: true });
});

const freePort = () =>
  new Promise<number>((resolve) => {
    const srv = createServer().listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });

/** Poll `check` until it returns a value, or fail naming what was awaited (never fall through silently). */
async function waitFor<T>(what: string, check: () => Promise<T | null | undefined | false>, limitMs = 60_000, everyMs = 50): Promise<T> {
  const until = Date.now() + limitMs;
  for (;;) {
    const got = await check().catch(() => null);
    if (got) return got;
    if (Date.now() > until) throw new Error(`gave up after ${limitMs / 1000} s waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

describe('a server killed during a load', () => {
  it('when the server process is killed with SIGKILL mid-load, then none of the upload is kept and the upload is marked failed afterwards', async () => {
    // Where the kill lands does not depend on the machine's speed: the test holds a lock on the audit table,
    // so the intake, which writes its audit event last inside its transaction (after every row, the
    // district series and the "done" status), waits there, its work written but not committed. The
    // test kills the server once PostgreSQL shows that wait.
    const STATIONS = 100;
    await t.ds.query(
      `INSERT INTO weather_stations (code, name, latitude, longitude) SELECT 'K-' || i, 'Kill ' || i, -40 + i * 0.01, -70 FROM generate_series(1, $1) i`,
      [STATIONS],
    );
    const officer = await makeUser(t.ds, { role: 'officer' });
    const port = await freePort();
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
      cwd: process.cwd(),
      stdio: ['ignore', 'ignore', 'inherit'],
      env: {
        ...process.env, NODE_ENV: 'test', PORT: String(port), HOST: '127.0.0.1', DATABASE_URL: process.env.DATABASE_URL, JWT_SECRET: TEST_JWT_SECRET,
        BCRYPT_COST: '4', LOG_LEVEL: 'silent', SMTP_PORT: process.env.TEST_SMTP_PORT ?? '1026', WEATHER_UPLOAD_DIR: uploadDir, WEATHER_SWEEP_CRON: '0 0 1 1 *',
        WEATHER_HEARTBEAT_MS: '20',
      },
    });
    const exited = new Promise((r) => child.once('exit', r));
    const lock = t.ds.createQueryRunner();
    try {
      const base = `http://127.0.0.1:${port}`;
      await waitFor(`the spawned server to answer ${base}/api/health`, async () => {
        if (child.exitCode !== null) throw new Error(`the spawned server exited (${child.exitCode}) before answering`);
        return fetch(`${base}/api/health`).then((r) => r.text().then(() => r.ok), () => false);
      });
      const signIn = await fetch(`${base}/api/auth/sign-in`, {
        method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: officer.email, password: TEST_PASSWORD }),
      });
      await signIn.text();
      expect(signIn.status, 'sign-in on the spawned server').toBe(200);
      const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
      let body = 'station,date,tmin,tmax,rh,rain\n';
      for (let s = 1; s <= STATIONS; s++)
        for (let d = 0; d < 365; d++) {
          const date = new Date(Date.UTC(2025, 0, 1 + d)).toISOString().slice(0, 10);
          body += `K-${s},${date},${10 + (d % 5)},${20 + (d % 7)},${50 + (d % 9)},${d % 3}\n`;
        }
      const before = await countRows(t.ds, 'weather_observations', 'weather_observation_revisions', 'district_weather_days', 'audit_events');

      await lock.connect();
      await lock.startTransaction();
      await lock.query('LOCK TABLE audit_events IN SHARE MODE'); // an INSERT waits; reads go on

      const form = new FormData();
      form.set('tempUnit', 'C');
      form.set('file', new Blob([body], { type: 'text/csv' }), 'big.csv');
      const res = await fetch(`${base}/api/weather/uploads`, { method: 'POST', body: form, headers: { cookie } });
      const upload = (await res.json()) as { id: string; status: string };
      expect(res.status).toBe(201);
      expect(upload.status).toBe('processing');

      await waitFor('the intake to wait on the audit lock at the end of its transaction (pg_stat_activity)', async () => {
        const rows: unknown[] = await t.ds.query(
          `SELECT 1 FROM pg_stat_activity WHERE wait_event_type = 'Lock' AND query ILIKE 'INSERT INTO "audit_events"%' AND pid <> pg_backend_pid()`,
        );
        return rows.length > 0;
      });
      const [{ status: statusAtKill }] = await t.ds.query('SELECT status FROM weather_uploads WHERE id = $1', [upload.id]);
      child.kill('SIGKILL');
      await exited;
      await lock.rollbackTransaction();
      // Its "done" was written in the intake's transaction, not yet committed: others still see it processing.
      expect(statusAtKill).toBe('processing');
      // (Whether a heartbeat landed before the end depends on the machine's speed, so it is not asserted:
      // the lock wait above already shows the intake read, checked and wrote every row.)

      // PostgreSQL rolls back the dead connection's transaction: the upload's rows are all absent.
      await waitFor('PostgreSQL to end the killed server\'s sessions', async () => {
        const rows: unknown[] = await t.ds.query(
          `SELECT 1 FROM pg_stat_activity WHERE datname = current_database() AND query ILIKE 'INSERT INTO "audit_events"%' AND pid <> pg_backend_pid()`,
        );
        return rows.length === 0;
      });
      expect(await countRows(t.ds, 'weather_observations', 'weather_observation_revisions', 'district_weather_days', 'audit_events')).toEqual(before);

      // The sweep (every minute in a running server; also on each read of an upload) marks it failed once its heartbeat is stale.
      const later = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', WEATHER_UPLOAD_STALE_SECONDS: '1' });
      try {
        await new Promise((r) => setTimeout(r, 1100));
        const agent = await signedInAgent(later.app, officer.email);
        const after = await agent.get(`/api/weather/uploads/${upload.id}`);
        expect(after.body.status).toBe('failed');
        expect(after.body.message).toMatch(/nothing from it was saved/);
      } finally {
        await later.close();
      }
    } finally {
      if (lock.isTransactionActive) await lock.rollbackTransaction().catch(() => undefined);
      await lock.release().catch(() => undefined);
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
    }
  }, 180_000);
});
