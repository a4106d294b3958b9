/**
 * Fault drill: stop PostgreSQL while the app runs. The drill starts a throw-away cluster of its own
 * (never the dev or test cluster others use): data in .local/pg/drill, port DRILL_PGPORT (54340), loads
 * the invented Halvern Region, starts the real server on it and signs in. Then, OUTAGES times: stop the
 * cluster, drive the API for a few seconds (every answer must be a 503 `database_unavailable` with its
 * message, none a 500, none hanging), start the cluster again, and time how long until the same server
 * (not restarted) answers 200 again. The client shows the 503's message (tests/client/database-unavailable.test.tsx).
 * Run: tsx bench/drills/database-down.drill.ts [--quick] [--repeat N]
 * The last line of the output is one JSON object with the figures.
 */
import 'reflect-metadata';
import { rmSync } from 'node:fs';
import { ensureDatabase, startCluster, stopCluster, type Cluster } from '../../scripts/lib/cluster';
import { migrate } from '../../scripts/lib/prepare-database';
import { loadLocalSecrets } from '../../scripts/lib/secrets';
import { freePort, isQuick, option, printFigures, projectDir, serverEnv, signIn, sleep, startServer } from './drill-lib';

const QUICK = isQuick();
const OUTAGES = option('repeat', QUICK ? 1 : 3);
const DOWN_SECONDS = option('down-seconds', QUICK ? 3 : 6);
const PGPORT = Number(process.env.DRILL_PGPORT ?? 54340);

// The cluster helper knows the dev and test clusters by name; the drill's own one lives beside them.
const start = () => startCluster({ projectDir, name: 'drill', port: PGPORT, durable: false });
let cluster: Cluster = await start();
const secrets = loadLocalSecrets(projectDir, 'drill');
const url = await ensureDatabase(cluster, { name: 'broodcast_drill_down', user: 'broodcast', password: secrets.databasePassword, fresh: true });
await migrate(url, { seedDemo: { nodeEnv: 'development', bcryptCost: 4 } });

const port = await freePort();
const server = await startServer(serverEnv(url, secrets.jwtSecret, port, { DATABASE_POOL_SIZE: '5' }));
const cookie = await signIn(server.base, 'officer@halvern.example', 'broodcast-demo');
const paths = ['/api/board', '/api/districts', '/api/me', '/api/cases/settings'];

const get = async (path: string) => {
  const t0 = performance.now();
  try {
    const res = await fetch(`${server.base}${path}`, { headers: { cookie }, signal: AbortSignal.timeout(15_000) });
    const text = await res.text();
    let body: { error?: { code?: string; message?: string } } = {};
    try { body = JSON.parse(text); } catch { /* not JSON */ }
    return { status: res.status, code: body.error?.code ?? null, message: body.error?.message ?? null, ms: performance.now() - t0 };
  } catch (err) {
    return { status: 0, code: (err as Error).name, message: (err as Error).message, ms: performance.now() - t0 };
  }
};

interface Outage { requests: number; answered503: number; other: Record<string, number>; slowestMs: number; resumeSeconds: number; healthDown: boolean }
const outages: Outage[] = [];
let message: string | null = null;
try {
  for (const p of paths) {
    const r = await get(p);
    if (r.status !== 200) throw new Error(`${p} answered ${r.status} before the outage`);
  }
  for (let o = 0; o < OUTAGES; o++) {
    stopCluster(cluster);
    const outage: Outage = { requests: 0, answered503: 0, other: {}, slowestMs: 0, resumeSeconds: 0, healthDown: false };
    const until = Date.now() + DOWN_SECONDS * 1000;
    while (Date.now() < until) {
      const rs = await Promise.all(paths.map(get));
      for (const r of rs) {
        outage.requests++;
        outage.slowestMs = Math.max(outage.slowestMs, r.ms);
        if (r.status === 503 && r.code === 'database_unavailable') {
          outage.answered503++;
          message = r.message;
        } else outage.other[`${r.status} ${r.code}`] = (outage.other[`${r.status} ${r.code}`] ?? 0) + 1;
      }
      await sleep(100);
    }
    const health = await fetch(`${server.base}/api/health`).then(async (r) => ({ status: r.status, body: await r.json() }));
    outage.healthDown = health.status === 503 && health.body.database === 'down';
    const t0 = performance.now();
    cluster = await start();
    for (;;) {
      const rs = await Promise.all(paths.map(get));
      if (rs.every((r) => r.status === 200)) break;
      if (performance.now() - t0 > 60_000) throw new Error('the API did not resume within 60 s of the database returning');
      await sleep(50);
    }
    outage.resumeSeconds = (performance.now() - t0) / 1000;
    outages.push(outage);
    console.log(
      `database down ${DOWN_SECONDS} s (outage ${o + 1}/${OUTAGES}): ${outage.requests} requests, ${outage.answered503} answered 503 database_unavailable, ` +
      `other answers: ${JSON.stringify(outage.other)}, slowest ${outage.slowestMs.toFixed(0)} ms, /api/health said down: ${outage.healthDown}; ` +
      `back to 200 ${outage.resumeSeconds.toFixed(2)} s after the database started (same server process)`,
    );
  }
} finally {
  await server.kill('SIGTERM');
  stopCluster(cluster);
  if (process.env.DRILL_KEEP_CLUSTER !== '1') rmSync(cluster.dataDir, { recursive: true, force: true });
}
console.log(`message shown: "${message}"`);
const requests = outages.reduce((a, o) => a + o.requests, 0);
const answered503 = outages.reduce((a, o) => a + o.answered503, 0);
printFigures({
  drill: 'database-down', outages: OUTAGES, downSeconds: DOWN_SECONDS, requests, answered503, otherAnswers: requests - answered503,
  slowestMs: Math.round(Math.max(...outages.map((o) => o.slowestMs))), resumeSeconds: +Math.max(...outages.map((o) => o.resumeSeconds)).toFixed(2),
  healthSaidDown: outages.every((o) => o.healthDown), message,
});
process.exit(0);
