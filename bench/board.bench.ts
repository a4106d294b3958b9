/**
 * Benchmark of the board (issue 6), all on this machine, against a bench database on the dev cluster:
 *  1. loads N districts (default 5,000) with five profiles each, four seasons of daily weather and
 *     seven years of weekly counts (SQL generate_series: invented numbers);
 *  2. times a full season run, an incremental run with nothing changed, and one with 1 % changed;
 *  3. starts the real server and a bare Express server that sends an already-serialised payload of the
 *     same size, and drives both with autocannon (10, then 50 connections, DURATION s each),
 *     printing requests per second and p50 / p99 latency side by side.
 * Run: npm run bench:board   (env: BENCH_DISTRICTS=5000 BENCH_DURATION=30; BENCH_REUSE=1 keeps the loaded
 * bench database of an earlier run with the same BENCH_DISTRICTS; BENCH_HTTP=0 stops after the season runs)
 * The last line of its output is one JSON object with every figure.
 */
import 'reflect-metadata';
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import express from 'express';
import { gzipSync } from 'node:zlib';
import type { AddressInfo } from 'node:net';
import { createDataSource } from '../server/db/data-source';
import { parseConfig } from '../server/config';
import { createLogger } from '../server/logger';
import type { AppContext } from '../server/app-context';
import { SeasonRunService } from '../server/season/season-run.service';
import { hashPassword } from '../server/auth/passwords';
import { PROFILE_IDS } from '../shared/model';
import { startDevDatabase } from '../scripts/lib/dev-database';
import { ensureDatabase } from '../scripts/lib/cluster';
import { migrate } from '../scripts/lib/prepare-database';

const N = Number(process.env.BENCH_DISTRICTS ?? 5000);
const DURATION = Number(process.env.BENCH_DURATION ?? 30);
const AS_OF = '2026-11-30';
const PORT = Number(process.env.BENCH_PORT ?? 5280);
const BARE_PORT = PORT + 1;

const { cluster, secrets } = await startDevDatabase();
const REUSE = process.env.BENCH_REUSE === '1';
const HTTP = process.env.BENCH_HTTP !== '0';
const url = await ensureDatabase(cluster, { name: 'broodcast_bench_board', user: 'broodcast', password: secrets.databasePassword, fresh: !REUSE });
await migrate(url);
const env = { NODE_ENV: 'development', DATABASE_URL: url, JWT_SECRET: secrets.jwtSecret, LOG_LEVEL: 'warn', PORT: String(PORT), SEASON_RUN_ON_START: 'false', SEASON_RUN_CRON: '', DATABASE_POOL_SIZE: '20' };
const config = parseConfig(env);
const ds = createDataSource(url, 20);
await ds.initialize();
const ctx: AppContext = { config, ds, logger: createLogger(config), mailer: { send: async () => undefined, close: () => undefined } };

const t = (label: string) => { const s = performance.now(); return () => { const ms = performance.now() - s; console.log(`  ${label}: ${(ms / 1000).toFixed(2)} s`); return ms; }; };

const [{ n: loaded }] = await ds.query(`SELECT count(*)::int AS n FROM districts`);
let done = t('load');
if (REUSE && loaded === N) {
  console.log(`Reusing the loaded bench database (${N} districts)`);
  await ds.query(`DELETE FROM users WHERE email = 'bench@bench.example'`);
} else {
if (loaded > 0) throw new Error(`the bench database holds ${loaded} districts, not ${N}: run without BENCH_REUSE`);
console.log(`Loading ${N} districts …`);
await ds.query(
  `INSERT INTO districts (code, name, is_demo, centroid_lat, centroid_lon, boundary)
   SELECT 'B-' || lpad(i::text, 5, '0'), 'Bench district ' || i, true, 5 + (i % 100) * 0.35, 10 + (i / 100) * 0.5,
          json_build_object('type', 'Polygon', 'coordinates', json_build_array(json_build_array(
            json_build_array(10 + (i / 100) * 0.5, 5 + (i % 100) * 0.35), json_build_array(10.5 + (i / 100) * 0.5, 5 + (i % 100) * 0.35),
            json_build_array(10.5 + (i / 100) * 0.5, 5.35 + (i % 100) * 0.35), json_build_array(10 + (i / 100) * 0.5, 5 + (i % 100) * 0.35))))
     FROM generate_series(1, $1) AS i`, [N]);
await ds.query(`INSERT INTO district_profiles (district_id, profile_id) SELECT d.id, p FROM districts d, unnest($1::text[]) AS p`, [PROFILE_IDS]);
await ds.query(
  `INSERT INTO district_weather_days (district_id, date, tmin, tmax, rh, rain, filled, station_count)
   SELECT d.id, day::date,
          22 - (d.centroid_lat - 5) * 0.4 + 7 * sin(2 * pi() * (extract(doy FROM day) - 110) / 365) + (hashtext(d.code || day::text) % 100) / 50.0,
          31 - (d.centroid_lat - 5) * 0.4 + 7 * sin(2 * pi() * (extract(doy FROM day) - 110) / 365) + (hashtext(day::text || d.code) % 100) / 50.0,
          65, 3, false, 1
     FROM districts d, generate_series('2023-01-01'::date, $1::date, interval '1 day') AS day`, [AS_OF]);
const [disease] = await ds.query(`INSERT INTO diseases (code, name, profile_ids) VALUES ('BENCH', 'Bench disease', '{}') RETURNING id`);
await ds.query(
  `INSERT INTO case_counts (district_id, disease_id, epi_year, epi_week, cases, reported_at, updated_at)
   SELECT d.id, $1, y, w, abs(hashtext(d.code || y || w)) % 12, now(), now()
     FROM districts d, generate_series(2020, 2026) AS y, generate_series(1, 48) AS w`, [disease.id]);
await ds.query('ANALYZE');
}
const loadMs = done();

const service = new SeasonRunService(ctx);
console.log('Season runs:');
done = t(`full run (${N} districts × ${PROFILE_IDS.length} profiles)`);
const full = await service.runLocked({ kind: 'manual', full: true, asOf: AS_OF });
const fullMs = done();
console.log(`    ${full!.status}, ${full!.rowsWritten.toLocaleString('en')} rows written`);
done = t('incremental run, nothing changed');
const idle = await service.runLocked({ kind: 'nightly', asOf: AS_OF });
const idleMs = done();
await ds.query(`UPDATE district_weather_days SET tmax = tmax + 0.5 WHERE date = $1 AND district_id IN (SELECT id FROM districts ORDER BY code LIMIT $2)`, [AS_OF, Math.ceil(N / 100)]);
done = t('incremental run, 1 % of districts changed');
const inc = await service.runLocked({ kind: 'nightly', asOf: AS_OF });
const incMs = done();
console.log(`    ${idle!.districtsDone} and ${inc!.districtsDone} districts recomputed`);

const seasonFigures = {
  districts: N, profiles: PROFILE_IDS.length, loadSeconds: +(loadMs / 1000).toFixed(1), rowsWritten: full!.rowsWritten,
  fullRunSeconds: +(fullMs / 1000).toFixed(1), incrementalUnchangedSeconds: +(idleMs / 1000).toFixed(1), incrementalChangedSeconds: +(incMs / 1000).toFixed(1),
  goals: { fullRunSeconds: 60, incrementalSeconds: 10 },
};
if (!HTTP) {
  console.log(`\nSeason run: full ${(fullMs / 1000).toFixed(1)} s (goal < 60 s); incremental ${(idleMs / 1000).toFixed(1)} s unchanged, ${(incMs / 1000).toFixed(1)} s with 1 % changed (goal < 10 s)`);
  console.log(JSON.stringify({ season: seasonFigures }));
  await ds.destroy();
  process.exit(0);
}

// A user to sign in as; the cookie goes with every autocannon request.
await ds.query(`INSERT INTO users (email, display_name, role, password_hash) VALUES ('bench@bench.example', 'Bench', 'officer', $1)`, [await hashPassword('bench-password-1', 4)]);
await ds.destroy();

const server = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], { env: { ...process.env, ...env }, stdio: ['ignore', 'ignore', 'inherit'] });
await waitFor(`http://127.0.0.1:${PORT}/api/health`);
const signIn = await fetch(`http://127.0.0.1:${PORT}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@bench.example', password: 'bench-password-1' }) });
await signIn.text();
const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
const payload = await (await fetch(`http://127.0.0.1:${PORT}/api/board`, { headers: { cookie } })).text();
console.log(`Board payload: ${(payload.length / 1e6).toFixed(2)} MB, ${JSON.parse(payload).rows.length} rows`);

// The bare peer: Express sending the same bytes, already serialised (and, for clients that accept it,
// already gzip-compressed with the same level), no session, no database.
const payloadGzip = gzipSync(payload, { level: 6 });
const bare = express();
bare.get('/board', (req, res) => {
  res.type('application/json');
  if (req.acceptsEncodings('gzip') === 'gzip') res.set('Content-Encoding', 'gzip').send(payloadGzip);
  else res.send(payload);
});
const bareServer = bare.listen(BARE_PORT, '127.0.0.1');
await new Promise((r) => bareServer.once('listening', r));
const bareUrl = `http://127.0.0.1:${(bareServer.address() as AddressInfo).port}/board`;
console.log(`gzip: ${(payloadGzip.length / 1e6).toFixed(2)} MB on the wire (${(payloadGzip.length / payload.length * 100).toFixed(0)} %)`);

type HttpRow = { endpoint: string; encoding: string; connections: number; rps: number; p50: number; p99: number; errors: number };
const rows: HttpRow[] = [];
// identity: what a client that does not ask for compression gets (the reference figures);
// gzip: what a browser gets (every browser sends Accept-Encoding: gzip).
for (const encoding of ['identity', 'gzip'] as const) {
  for (const connections of [10, 50]) {
    for (const [endpoint, target, extra] of [['Broodcast GET /api/board', `http://127.0.0.1:${PORT}/api/board`, { cookie }], ['bare Express, same payload', bareUrl, {}]] as const) {
      const r = await autocannon({ url: target, connections, duration: DURATION, headers: { ...extra, 'accept-encoding': encoding } });
      rows.push({ endpoint, encoding, connections, rps: Math.round(r.requests.average), p50: r.latency.p50, p99: r.latency.p99, errors: r.non2xx + r.errors });
    }
  }
}
server.kill('SIGTERM');
bareServer.close();

console.log('\n| endpoint | encoding | connections | req/s | p50 ms | p99 ms | errors |\n|---|---|---|---|---|---|---|');
for (const r of rows) console.log(`| ${r.endpoint} | ${r.encoding} | ${r.connections} | ${r.rps} | ${r.p50} | ${r.p99} | ${r.errors} |`);
const ratios: Record<string, number> = {};
for (const encoding of ['identity', 'gzip']) {
  for (const c of [10, 50]) {
    const [a, b] = rows.filter((r) => r.encoding === encoding && r.connections === c);
    ratios[`${encoding}@${c}`] = +(a.rps / b.rps).toFixed(2);
    console.log(`${encoding}, ${c} connections: ${(a.rps / b.rps).toFixed(2)} of the bare endpoint's throughput; p99 ${a.p99} ms (bare ${b.p99} ms)`);
  }
}
console.log(`\nSeason run: full ${(fullMs / 1000).toFixed(1)} s (goal < 60 s); incremental ${(idleMs / 1000).toFixed(1)} s unchanged, ${(incMs / 1000).toFixed(1)} s with 1 % changed (goal < 10 s)`);
console.log(JSON.stringify({ season: seasonFigures, board: { payloadBytes: payload.length, gzipBytes: payloadGzip.length, durationSeconds: DURATION, rows, ratios, goals: { throughputRatioAt50: 0.5, p99At10Ms: 100 } } }));
process.exit(0);

async function waitFor(u: string) {
  for (let i = 0; i < 200; i++) {
    try { const r = await fetch(u); await r.text(); if (r.ok) return; } catch { /* not yet */ }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${u} did not answer`);
}
