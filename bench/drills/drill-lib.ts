/**
 * What the fault drills share: their own databases on the dev cluster (never the demo database, never
 * the test cluster), the real server spawned as a child process, free ports, sign-in, row counts, and
 * the last-line JSON every drill prints for `npm run bench`.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import { createServer } from 'node:net';
import pg from 'pg';
import { ensureDatabase } from '../../scripts/lib/cluster';
import { projectDir, startDevDatabase } from '../../scripts/lib/dev-database';
import { migrate } from '../../scripts/lib/prepare-database';

export { projectDir };

/** `--quick` or `--repeat N` on the command line; BENCH_QUICK=1 in the environment means the same. */
export const isQuick = () => process.argv.includes('--quick') || process.env.BENCH_QUICK === '1';
export function option(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer().listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
    srv.on('error', reject);
  });
}

/** A fresh, migrated database of the drill's own on the dev cluster; `seedDemo` loads the invented Halvern Region. */
export async function drillDatabase(name: string, opts: { seedDemo?: boolean } = {}) {
  const { cluster, secrets } = await startDevDatabase();
  const url = await ensureDatabase(cluster, { name, user: 'broodcast', password: secrets.databasePassword, fresh: true });
  await migrate(url, opts.seedDemo ? { seedDemo: { nodeEnv: 'development', bcryptCost: 4 } } : {});
  return { url, jwtSecret: secrets.jwtSecret };
}

/** A plain pg pool for the drill's own checks (counts, set-up SQL). */
export const pool = (url: string, max = 4) => new pg.Pool({ connectionString: url, max });

/** Settings of a drill server: quiet, no scheduled season run, cheap password hashing. */
export function serverEnv(url: string, jwtSecret: string, port: number, extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  return {
    ...process.env,
    NODE_ENV: 'development',
    PORT: String(port),
    HOST: '127.0.0.1',
    DATABASE_URL: url,
    JWT_SECRET: jwtSecret,
    BCRYPT_COST: '4',
    LOG_LEVEL: process.env.DRILL_LOG_LEVEL ?? 'silent',
    SEASON_RUN_ON_START: 'false',
    SEASON_RUN_CRON: '',
    BULLETIN_CRON: '',
    WEATHER_SWEEP_CRON: '0 0 1 1 *',
    SIGN_IN_LIMIT_PER_ADDRESS: '100000',
    SIGN_IN_LIMIT_PER_ACCOUNT: '100000',
    SMTP_PORT: '9', // closed unless a drill gives its own mail catcher
    ...extra,
  };
}

/** Servers still running when the drill process ends (an error part-way) are killed with it. */
const children = new Set<ChildProcess>();
process.once('exit', () => {
  for (const c of children) c.kill('SIGKILL');
});

export interface DrillServer {
  child: ChildProcess;
  base: string;
  exited: Promise<void>;
  kill(signal?: NodeJS.Signals): Promise<void>;
}

/** `node --import tsx server/main.ts` with the given settings; resolves once /api/health answers. */
export async function startServer(env: NodeJS.ProcessEnv, opts: { healthTimeoutMs?: number } = {}): Promise<DrillServer> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], { cwd: projectDir, env, stdio: ['ignore', 'ignore', 'pipe'] });
  // The server's own errors pass through; node-cron's overlap warnings (a drill's one-second outbox) do not.
  let rest = '';
  child.stderr!.on('data', (b: Buffer) => {
    const lines = (rest + b.toString()).split('\n');
    rest = lines.pop() ?? '';
    for (const l of lines) if (!/NODE-CRON/.test(l)) process.stderr.write(`${l}\n`);
  });
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  children.add(child);
  child.once('exit', () => children.delete(child));
  const base = `http://127.0.0.1:${env.PORT}`;
  const until = Date.now() + (opts.healthTimeoutMs ?? 60_000);
  for (;;) {
    if (child.exitCode !== null || child.signalCode !== null) throw new Error(`the server exited (${child.exitCode ?? child.signalCode}) before answering`);
    const ok = await fetch(`${base}/api/health`).then((r) => r.text().then(() => r.ok), () => false);
    if (ok) break;
    if (Date.now() > until) {
      child.kill('SIGKILL');
      throw new Error(`${base}/api/health did not answer`);
    }
    await sleep(100);
  }
  return {
    child, base, exited,
    async kill(signal: NodeJS.Signals = 'SIGTERM') {
      if (child.exitCode === null && child.signalCode === null) child.kill(signal);
      await exited;
    },
  };
}

/** Sign in over HTTP; returns the `broodcast_session=…` cookie. */
export async function signIn(base: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }),
  });
  const body = await res.text();
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${body}`);
  return res.headers.get('set-cookie')!.split(';')[0];
}

/** Row counts of the named tables, in one statement. */
export async function countRows(db: pg.Pool | pg.Client, tables: readonly string[]): Promise<Record<string, number>> {
  const sql = `SELECT ${tables.map((t, i) => `(SELECT count(*)::int FROM "${t}") AS c${i}`).join(', ')}`;
  const [row] = (await db.query(sql)).rows;
  return Object.fromEntries(tables.map((t, i) => [t, row[`c${i}`] as number]));
}

export const sameCounts = (a: Record<string, number>, b: Record<string, number>) =>
  Object.keys(a).length === Object.keys(b).length && Object.keys(a).every((k) => a[k] === b[k]);

/** The last line of a drill's output: one JSON object with its figures (read by bench/run-all.ts). */
export function printFigures(figures: Record<string, unknown>) {
  console.log(JSON.stringify(figures));
}

/**
 * Wait until another connection to the drill's database has held a transaction open for `minAgeMs`
 * (the server is inside the operation); false when none did within `timeoutMs`.
 */
export async function waitForOpenTransaction(db: pg.Pool, minAgeMs: number, timeoutMs = 30_000): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const { rows } = await db.query(
      `SELECT 1 FROM pg_stat_activity
        WHERE datname = current_database() AND pid <> pg_backend_pid() AND backend_type = 'client backend'
          AND xact_start IS NOT NULL AND state <> 'idle' AND now() - xact_start >= make_interval(secs => $1)`,
      [minAgeMs / 1000],
    );
    if (rows.length) return true;
    await sleep(10);
  }
  return false;
}
