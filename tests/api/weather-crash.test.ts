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

describe('a server killed during a load', () => {
  it('when the server process is killed with SIGKILL mid-load, then none of the upload is kept and the upload is marked failed afterwards', async () => {
    // 3,000 stations × 365 days (about 36 MB): long enough that the first heartbeat (after 1 s) still finds
    // the rows being read and checked on a quiet machine, so the kill lands mid-load.
    const STATIONS = 3000;
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
        WEATHER_HEARTBEAT_MS: '20', // the whole load takes about a second: report often, so the kill lands inside it
      },
    });
    const exited = new Promise((r) => child.once('exit', r));
    try {
      const base = `http://127.0.0.1:${port}`;
      for (let i = 0; i < 100; i++) {
        const ok = await fetch(`${base}/api/health`).then((r) => r.text().then(() => r.ok), () => false);
        if (ok) break;
        await new Promise((r) => setTimeout(r, 100));
      }
      const signIn = await fetch(`${base}/api/auth/sign-in`, {
        method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: officer.email, password: TEST_PASSWORD }),
      });
      await signIn.text();
      const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
      let body = 'station,date,tmin,tmax,rh,rain\n';
      for (let s = 1; s <= STATIONS; s++)
        for (let d = 0; d < 365; d++) {
          const date = new Date(Date.UTC(2025, 0, 1 + d)).toISOString().slice(0, 10);
          body += `K-${s},${date},${10 + (d % 5)},${20 + (d % 7)},${50 + (d % 9)},${d % 3}\n`;
        }
      const before = await countRows(t.ds, 'weather_observations', 'weather_observation_revisions', 'district_weather_days');
      const form = new FormData();
      form.set('tempUnit', 'C');
      form.set('file', new Blob([body], { type: 'text/csv' }), 'big.csv');
      const res = await fetch(`${base}/api/weather/uploads`, { method: 'POST', body: form, headers: { cookie } });
      const upload = (await res.json()) as { id: string; status: string };
      expect(res.status).toBe(201);
      expect(upload.status).toBe('processing');
      // Wait until the load is under way (the heartbeat reports rows processed), then kill without warning.
      let processed = 0;
      for (let i = 0; i < 200 && processed === 0; i++) {
        await new Promise((r) => setTimeout(r, 25));
        [{ rows_processed: processed }] = await t.ds.query('SELECT rows_processed FROM weather_uploads WHERE id = $1', [upload.id]);
      }
      const [{ status: statusAtKill }] = await t.ds.query('SELECT status FROM weather_uploads WHERE id = $1', [upload.id]);
      child.kill('SIGKILL');
      await exited;
      expect(statusAtKill).toBe('processing');
      // The kill lands after the server began on the file and before it finished: while rows are read, or while the
      // checked rows are being written (reading a file this size takes the intake under a second).
      expect(processed).toBeGreaterThan(0);
      // PostgreSQL rolls back the dead connection's transaction: the upload's rows are all absent.
      await new Promise((r) => setTimeout(r, 300));
      expect(await countRows(t.ds, 'weather_observations', 'weather_observation_revisions', 'district_weather_days')).toEqual(before);

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
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
    }
  }, 60_000);
});
