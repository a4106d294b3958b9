/**
 * Load: SESSIONS signed-in users (epidemiologists of the invented Halvern Region, each with a session
 * of their own) using the Ladder, District files and case entry at once for DURATION seconds, driven by
 * autocannon on loopback with one connection per session:
 *   GET /api/board  ·  GET /api/districts/:id/file  ·  PUT /api/districts/:id/cases (a weekly count, with a reason)
 * in the mix board, file, board, file, entry. It prints requests per second, p50 / p99 per route and
 * every error or non-2xx answer (the goal: none), then the same mix against a bare Express peer answering
 * already-serialised payloads of the same sizes, on the same machine, and the ratios.
 * Uses its own database (broodcast_bench_load on the dev cluster, re-created each run).
 * Run: npm run bench:load   (options: --sessions 200 --duration 60 --quick)
 * The last line of the output is one JSON object with every figure.
 */
import 'reflect-metadata';
import autocannon from 'autocannon';
import express from 'express';
import type { AddressInfo } from 'node:net';
import { hashPassword } from '../server/auth/passwords';
import { drillDatabase, freePort, isQuick, option, pool, printFigures, serverEnv, signIn, sleep, startServer } from './drills/drill-lib';

const QUICK = isQuick();
const SESSIONS = option('sessions', 200);
const DURATION = option('duration', QUICK ? 10 : 60);
const PASSWORD = 'load-password-42';
type Route = 'board' | 'file' | 'entry';
const MIX: Route[] = ['board', 'file', 'board', 'file', 'entry'];

const { url, jwtSecret } = await drillDatabase('broodcast_bench_load', { seedDemo: true });
const db = pool(url);
const hash = await hashPassword(PASSWORD, 4);
await db.query(
  `INSERT INTO users (email, display_name, role, password_hash)
   SELECT 'load-' || i || '@load.example', 'Load epidemiologist ' || i, 'epidemiologist', $2 FROM generate_series(1, $1) i`, [SESSIONS, hash]);
// Each user is assigned one district, round the twelve, and enters counts there.
await db.query(
  `INSERT INTO user_districts (user_id, district_id)
   SELECT u.id, d.id FROM (SELECT id, row_number() OVER (ORDER BY email) AS n FROM users WHERE email LIKE 'load-%') u
     JOIN (SELECT id, row_number() OVER (ORDER BY code) - 1 AS k, count(*) OVER () AS total FROM districts) d ON d.k = u.n % d.total`);
const users: { email: string; districtId: string }[] = (await db.query(
  `SELECT u.email, ud.district_id AS "districtId" FROM users u JOIN user_districts ud ON ud.user_id = u.id WHERE u.email LIKE 'load-%' ORDER BY u.email`,
)).rows;
// Entries go to a disease of their own: the demo's counts carry confirmed/probable splits that a random
// lower count would (rightly) be refused against.
const [{ id: diseaseId }] = (await db.query(`INSERT INTO diseases (code, name) VALUES ('LOAD', 'Load drill disease') RETURNING id`)).rows;
const districtIds: string[] = (await db.query(`SELECT id FROM districts ORDER BY code`)).rows.map((r: { id: string }) => r.id);

const port = await freePort();
const server = await startServer(serverEnv(url, jwtSecret, port, { SEASON_RUN_ON_START: 'true', DATABASE_POOL_SIZE: '20' }));
// The start-up season run gives the Ladder its tiers.
for (let i = 0; i < 900; i++) {
  const [{ running, tiers }] = (await db.query(
    `SELECT (SELECT count(*)::int FROM season_runs WHERE status = 'running') AS running, (SELECT count(*)::int FROM district_tiers) AS tiers`)).rows;
  if (running === 0 && tiers > 0) break;
  await sleep(200);
}
await db.end();

console.log(`Signing in ${SESSIONS} users …`);
const cookies: string[] = [];
for (let i = 0; i < users.length; i += 20)
  cookies.push(...(await Promise.all(users.slice(i, i + 20).map((u) => signIn(server.base, u.email, PASSWORD)))));

const year = new Date().getUTCFullYear();
// Each user enters its own weeks of its district (weeks 1–40 dealt round the district's users), as real
// colleagues would: two people entering the same count at the same instant get 409 count_exists by design.
const perDistrict = Math.ceil(SESSIONS / districtIds.length);
const weeksOf = users.map((_, u) => Array.from({ length: 40 }, (_, i) => i + 1).filter((w) => (w - 1) % perDistrict === Math.floor(u / districtIds.length) % perDistrict));
const entryBody = (u = 0) => {
  const weeks = weeksOf[u].length ? weeksOf[u] : [1];
  return JSON.stringify({ diseaseId, year, week: weeks[Math.floor(Math.random() * weeks.length)], cases: Math.floor(Math.random() * 30), reason: 'load drill entry' });
};
// Payloads of the real answers, for the bare peer.
const probe = async (path: string, init: RequestInit = {}) => {
  const res = await fetch(`${server.base}${path}`, { ...init, headers: { cookie: cookies[0], 'content-type': 'application/json', ...(init.headers ?? {}) } });
  const text = await res.text();
  if (!res.ok) throw new Error(`${path} answered ${res.status}: ${text.slice(0, 300)}`);
  return text;
};
const payloads: Record<Route, string> = {
  board: await probe('/api/board'),
  file: await probe(`/api/districts/${users[0].districtId}/file`),
  entry: await probe(`/api/districts/${users[0].districtId}/cases`, { method: 'PUT', body: entryBody() }),
};
console.log(`Payloads: board ${payloads.board.length} B, District file ${payloads.file.length} B, entry answer ${payloads.entry.length} B`);

interface RouteStats { latencies: number[]; non2xx: number; statuses: Record<string, number> }
interface Result { requestsPerSecond: number; total: number; errors: number; timeouts: number; non2xx: number; p50: number; p99: number; perRoute: Record<Route, { requests: number; p50: number; p99: number; non2xx: number; statuses: Record<string, number> }> }

const pct = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : 0);

async function drive(base: string, paths: { file: (u: number) => string; entry: (u: number) => string }, withCookies: boolean): Promise<Result> {
  const stats: Record<Route, RouteStats> = { board: { latencies: [], non2xx: 0, statuses: {} }, file: { latencies: [], non2xx: 0, statuses: {} }, entry: { latencies: [], non2xx: 0, statuses: {} } };
  let nextUser = 0;
  type Ctx = { u?: number; route?: Route; t?: number };
  const request = (route: Route) => ({
    method: route === 'entry' ? 'PUT' : 'GET',
    // Each connection takes the next session the first time it builds a request, and keeps it.
    setupRequest: (req: Record<string, unknown>, context: Ctx) => {
      if (context.u === undefined) context.u = nextUser++ % SESSIONS;
      const u = context.u;
      context.route = route;
      context.t = performance.now();
      const headers: Record<string, string> = { ...(req.headers as Record<string, string>), ...(withCookies ? { cookie: cookies[u] } : {}) };
      if (route === 'board') return { ...req, path: '/api/board', headers };
      if (route === 'file') return { ...req, path: paths.file(u), headers };
      return { ...req, path: paths.entry(u), headers: { ...headers, 'content-type': 'application/json' }, body: entryBody(u) };
    },
    onResponse: (status: number, _body: string, context: Ctx) => {
      const s = stats[context.route!];
      s.latencies.push(performance.now() - context.t!);
      s.statuses[status] = (s.statuses[status] ?? 0) + 1;
      if (status < 200 || status >= 300) s.non2xx++;
    },
  });
  // A long list, so a connection rarely comes round to its start (where autocannon resets its context).
  const requests = Array.from({ length: MIX.length * 2000 }, (_, i) => request(MIX[i % MIX.length]));
  const r = await autocannon({ url: base, connections: SESSIONS, duration: DURATION, requests: requests as never, timeout: 30 });
  const perRoute = Object.fromEntries((Object.keys(stats) as Route[]).map((k) => {
    const sorted = stats[k].latencies.sort((a, b) => a - b);
    return [k, { requests: sorted.length, p50: +pct(sorted, 50).toFixed(1), p99: +pct(sorted, 99).toFixed(1), non2xx: stats[k].non2xx, statuses: stats[k].statuses }];
  })) as Result['perRoute'];
  return {
    requestsPerSecond: Math.round(r.requests.average), total: r.requests.total, errors: r.errors, timeouts: r.timeouts, non2xx: r.non2xx,
    p50: r.latency.p50, p99: r.latency.p99, perRoute,
  };
}

console.log(`Broodcast: ${SESSIONS} sessions for ${DURATION} s …`);
const broodcast = await drive(server.base, {
  file: (u) => `/api/districts/${districtIds[u % districtIds.length]}/file`,
  entry: (u) => `/api/districts/${users[u].districtId}/cases`,
}, true);
await server.kill('SIGTERM');

// The bare peer: Express answering the same bytes, already serialised, no session, no database.
const bare = express();
bare.get('/api/board', (_req, res) => { res.type('application/json').send(payloads.board); });
bare.get('/api/districts/:id/file', (_req, res) => { res.type('application/json').send(payloads.file); });
bare.put('/api/districts/:id/cases', express.json(), (_req, res) => { res.type('application/json').send(payloads.entry); });
const bareServer = bare.listen(await freePort(), '127.0.0.1');
await new Promise((r) => bareServer.once('listening', r));
console.log(`bare Express peer: ${SESSIONS} connections for ${DURATION} s …`);
const peer = await drive(`http://127.0.0.1:${(bareServer.address() as AddressInfo).port}`, {
  file: (u) => `/api/districts/${districtIds[u % districtIds.length]}/file`,
  entry: (u) => `/api/districts/${users[u].districtId}/cases`,
}, false);
bareServer.close();

console.log('\n| target | route | requests | p50 ms | p99 ms | non-2xx |\n|---|---|---|---|---|---|');
for (const [name, r] of [['Broodcast', broodcast], ['bare Express', peer]] as const) {
  for (const k of ['board', 'file', 'entry'] as Route[]) {
    const s = r.perRoute[k];
    console.log(`| ${name} | ${k === 'board' ? 'GET /api/board' : k === 'file' ? 'GET /api/districts/:id/file' : 'PUT /api/districts/:id/cases'} | ${s.requests} | ${s.p50} | ${s.p99} | ${s.non2xx} |`);
  }
  console.log(`| ${name} | all | ${r.total} (${r.requestsPerSecond}/s) | ${r.p50} | ${r.p99} | ${r.non2xx} (+ ${r.errors} errors, ${r.timeouts} timeouts) |`);
}
const ratioThroughput = broodcast.requestsPerSecond / Math.max(1, peer.requestsPerSecond);
const ratioP99 = broodcast.p99 / Math.max(1, peer.p99);
console.log(`\nthroughput: ${ratioThroughput.toFixed(2)} of the bare peer's; p99 ${ratioP99.toFixed(1)}× the bare peer's; errors + non-2xx: ${broodcast.errors + broodcast.non2xx} (goal 0)`);
printFigures({ sessions: SESSIONS, durationSeconds: DURATION, mix: MIX, broodcast, bare: peer, ratioThroughput: +ratioThroughput.toFixed(3), ratioP99: +ratioP99.toFixed(2), payloadBytes: { board: payloads.board.length, file: payloads.file.length, entry: payloads.entry.length } });
process.exit(0);
