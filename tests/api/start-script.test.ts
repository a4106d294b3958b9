import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { connect, createServer } from 'node:net';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runFile } from '../../scripts/lib/run-state';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * `npm start` stops what it started, in every state, and never a cluster it did not start (issue 14,
 * item 11). The start script runs for real (`scripts/start.ts --no-build --no-demo`) on free ports of
 * its own, against the test cluster that `npm test` started — so "a cluster not started by me" is the
 * very one these tests use, and it must still answer after every stop.
 */
const ROOT = path.resolve(import.meta.dirname, '../..');
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const freePort = () =>
  new Promise<number>((resolve) => {
    const srv = createServer().listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });
const listening = (port: number) =>
  new Promise<boolean>((resolve) => {
    const s = connect(port, '127.0.0.1');
    s.once('connect', () => (s.destroy(), resolve(true)));
    s.once('error', () => resolve(false));
  });
const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/** Poll until `check` holds, or fail naming what was awaited. Bounded: spawning node is slow on a busy machine. */
async function waitFor(what: string, check: () => boolean | Promise<boolean>, limitMs = 120_000): Promise<void> {
  const until = Date.now() + limitMs;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`gave up after ${limitMs / 1000} s waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

interface Started { proc: ChildProcess; output: () => string; exit: Promise<{ code: number | null; signal: NodeJS.Signals | null }> }

async function ports() {
  return { PORT: await freePort(), SMTP_PORT: await freePort(), MAIL_WEB_PORT: await freePort(), FEED_PORT: await freePort() };
}

function start(p: Awaited<ReturnType<typeof ports>>): Started {
  const pgPort = new URL(process.env.DATABASE_URL!).port;
  const proc = spawn(process.execPath, ['--import', 'tsx', 'scripts/start.ts', '--no-build', '--no-demo'], {
    cwd: ROOT,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: {
      ...process.env, PGPORT: pgPort, BROODCAST_CLUSTER: 'test', BROODCAST_DATABASE: 'broodcast_start_test', LOG_LEVEL: 'warn',
      PORT: String(p.PORT), SMTP_PORT: String(p.SMTP_PORT), MAIL_WEB_PORT: String(p.MAIL_WEB_PORT), FEED_PORT: String(p.FEED_PORT),
      WEATHER_FEED_CRON: '0 0 1 1 *',
    },
  });
  let out = '';
  proc.stdout!.on('data', (d) => (out += d));
  proc.stderr!.on('data', (d) => (out += d));
  const exit = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((r) => proc.once('exit', (code, signal) => r({ code, signal })));
  return { proc, output: () => out, exit };
}

async function running(s: Started) {
  try {
    // Bounded, generous: a first start migrates a new database and compiles the server on a busy machine.
    await waitFor('"Broodcast is running" from the start script', () => {
      if (s.proc.exitCode !== null) throw new Error(`the start script exited (${s.proc.exitCode})`);
      return s.output().includes('Broodcast is running');
    }, 240_000);
  } catch (err) {
    throw new Error(`${(err as Error).message}; its output:\n${s.output()}`);
  }
}
const serverPidOf = (appPort: number) => JSON.parse(readFileSync(runFile(ROOT, appPort), 'utf8')).serverPid as number;
const clusterAnswers = async () => (await t.ds.query('SELECT 1 AS ok'))[0].ok === 1;

describe('npm start (scripts/start.ts)', () => {
  it('when the server dies under a running start, then the start script stops the mail catcher and the feed, exits, and leaves the cluster it did not start running', async () => {
    const p = await ports();
    const s = start(p);
    try {
      await running(s);
      const serverPid = serverPidOf(p.PORT);
      expect(alive(serverPid)).toBe(true);
      process.kill(serverPid, 'SIGKILL');
      const { code } = await Promise.race([
        s.exit,
        new Promise<never>((_, rej) => setTimeout(() => rej(new Error(`the start script did not exit after its server died:\n${s.output()}`)), 60_000)),
      ]);
      expect(code).not.toBe(0);
      expect(s.output()).toMatch(/server exited \(SIGKILL\)/);
      expect(s.output()).toMatch(/leaving the PostgreSQL cluster running: it was running before this start/);
      expect(await listening(p.MAIL_WEB_PORT)).toBe(false);
      expect(await listening(p.FEED_PORT)).toBe(false);
      expect(existsSync(runFile(ROOT, p.PORT))).toBe(false);
      expect(await clusterAnswers()).toBe(true);
    } finally {
      if (s.proc.exitCode === null && s.proc.signalCode === null) s.proc.kill('SIGKILL');
    }
  }, 360_000);

  it('when a start was killed outright, then the next start stops the server it left behind and runs (no EADDRINUSE), and Ctrl-C stops everything but the cluster', async () => {
    const p = await ports();
    const first = start(p);
    const second = { s: null as Started | null };
    let orphan = 0;
    try {
      await running(first);
      orphan = serverPidOf(p.PORT);
      first.proc.kill('SIGKILL'); // a crash: no clean-up at all
      await first.exit;
      expect(alive(orphan)).toBe(true);
      expect(await listening(p.PORT)).toBe(true);

      second.s = start(p);
      await running(second.s);
      expect(second.s.output()).toMatch(/stopping the server \(pid \d+\) left running/);
      expect(alive(orphan)).toBe(false);
      const serverPid = serverPidOf(p.PORT);
      expect(serverPid).not.toBe(orphan);

      second.s.proc.kill('SIGINT'); // Ctrl-C
      const { code } = await Promise.race([
        second.s.exit,
        new Promise<never>((_, rej) => setTimeout(() => rej(new Error(`the start script did not stop on SIGINT:\n${second.s!.output()}`)), 60_000)),
      ]);
      expect(code).toBe(0);
      await waitFor('the server to be gone after Ctrl-C', () => !alive(serverPid), 30_000);
      expect(await listening(p.PORT)).toBe(false);
      expect(await listening(p.MAIL_WEB_PORT)).toBe(false);
      expect(existsSync(runFile(ROOT, p.PORT))).toBe(false);
      expect(await clusterAnswers()).toBe(true);
    } finally {
      for (const s of [first, second.s]) if (s && s.proc.exitCode === null && s.proc.signalCode === null) s.proc.kill('SIGKILL');
      if (orphan && alive(orphan)) process.kill(orphan, 'SIGKILL');
    }
  }, 600_000);
});
