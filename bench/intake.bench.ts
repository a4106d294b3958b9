/**
 * Benchmark of the weather intake: a generated national year (5,000 stations × 365 days = 1,825,000 rows)
 * uploaded through the HTTP endpoint of a real server process, against a plain COPY of the same file into a
 * bare table on the same cluster. Prints rows per second of both, their ratio, and the server's peak RSS.
 * Uses its own database (broodcast_bench, re-created from the migrations each run) on the dev cluster.
 * Run: npm run bench:intake   (options: --stations N --days N)
 */
import { spawn } from 'node:child_process';
import { createReadStream, createWriteStream, openAsBlob, readFileSync, rmSync, statSync } from 'node:fs';
import { createServer } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { pipeline } from 'node:stream/promises';
import bcrypt from 'bcryptjs';
import pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { startDevDatabase, projectDir } from '../scripts/lib/dev-database';
import { migrate } from '../scripts/lib/prepare-database';
import { seededRandom } from '../sample/random';

const option = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
};
const STATIONS = option('stations', 5000);
const DAYS = option('days', 365);
const ROWS = STATIONS * DAYS;

const { url: devUrl } = await startDevDatabase();
const benchUrl = devUrl.replace(/\/[^/]+$/, '/broodcast_bench');
{
  const c = new pg.Client({ connectionString: devUrl });
  await c.connect();
  await c.query('DROP DATABASE IF EXISTS broodcast_bench WITH (FORCE)');
  await c.query('CREATE DATABASE broodcast_bench');
  await c.end();
}
await migrate(benchUrl);
const db = new pg.Client({ connectionString: benchUrl });
await db.connect();

// Stations spread over a 10° × 10° country, and an officer to upload.
const random = seededRandom(4242);
const codes = Array.from({ length: STATIONS }, (_, i) => `B${String(i + 1).padStart(5, '0')}`);
await db.query(
  `INSERT INTO weather_stations (code, name, latitude, longitude, elevation)
   SELECT * FROM unnest($1::text[], $1::text[], $2::float8[], $3::float8[], $4::float8[])`,
  [codes, codes.map(() => 20 + random() * 10), codes.map(() => 60 + random() * 10), codes.map(() => Math.round(random() * 300))],
);
const email = 'bench-officer@bench.example';
const password = 'bench-password-123';
await db.query(`INSERT INTO users (email, display_name, role, password_hash) VALUES ($1, 'Bench officer', 'officer', $2)`, [email, bcrypt.hashSync(password, 4)]);

// The file: one station's year after another, smooth seasonal values (few flags), one decimal.
const file = path.join(os.tmpdir(), `broodcast-bench-${process.pid}.csv`);
{
  const out = createWriteStream(file);
  out.write('station,date,tmin,tmax,rh,rain\n');
  const dates = Array.from({ length: DAYS }, (_, d) => new Date(Date.UTC(2025, 0, 1 + d)).toISOString().slice(0, 10));
  for (let s = 0; s < STATIONS; s++) {
    let chunk = '';
    const offset = random() * 4;
    for (let d = 0; d < DAYS; d++) {
      const mean = 20 + offset + 8 * Math.sin((2 * Math.PI * (d - 110)) / 365) + Math.sin(d / 3.7);
      chunk += `${codes[s]},${dates[d]},${(mean - 5).toFixed(1)},${(mean + 5 + (d % 3) * 0.3).toFixed(1)},${50 + (d % 30)},${(d % 7) * 0.5}\n`;
    }
    if (!out.write(chunk)) await new Promise<void>((r) => out.once('drain', () => r()));
  }
  await new Promise((r) => out.end(r));
}
const bytes = statSync(file).size;
console.log(`file: ${ROWS.toLocaleString('en')} rows, ${(bytes / 1e6).toFixed(1)} MB`);

// Baseline: COPY of the same file into a bare table (no index, no checks), through pg-copy-streams.
await db.query('CREATE TABLE bench_plain (station text, date date, tmin float8, tmax float8, rh float8, rain float8)');
const t0 = performance.now();
await pipeline(createReadStream(file), db.query(copyFrom('COPY bench_plain FROM STDIN (FORMAT csv, HEADER true)')));
const plainSeconds = (performance.now() - t0) / 1000;
await db.query('DROP TABLE bench_plain');

// The real server, in its own process.
const port = await new Promise<number>((resolve) => {
  const srv = createServer().listen(0, '127.0.0.1', () => {
    const p = (srv.address() as { port: number }).port;
    srv.close(() => resolve(p));
  });
});
const child = spawn(process.execPath, [...(process.env.BENCH_PROF ? ['--cpu-prof', '--cpu-prof-dir=/tmp/prof'] : []), '--import', 'tsx', 'server/main.ts'], {
  cwd: projectDir,
  stdio: ['ignore', 'pipe', 'inherit'],
  env: { ...process.env, NODE_ENV: 'development', PORT: String(port), DATABASE_URL: benchUrl, JWT_SECRET: 'bench-secret-that-is-long-enough-for-signing', LOG_LEVEL: 'info' },
});
// The server logs one line per request; keep only the intake's stage timings.
let stagesMs: Record<string, number> | null = null;
createInterface({ input: child.stdout! }).on('line', (line) => {
  if (!line.includes('weather intake stages')) return;
  try {
    stagesMs = JSON.parse(line).stagesMs;
  } catch {
    /* not a JSON log line */
  }
});
// Never leave the server behind, whatever happens to the bench.
process.on('exit', () => child.kill('SIGKILL'));
const rssKb = () => {
  try {
    return Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${child.pid}/status`, 'utf8'))?.[1] ?? 0);
  } catch {
    return 0;
  }
};
const base = `http://127.0.0.1:${port}`;
try {
  for (let i = 0; i < 200; i++) {
    if (await fetch(`${base}/api/health`).then((r) => r.text().then(() => r.ok), () => false)) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  const idleRss = rssKb();
  const signIn = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  await signIn.text();
  const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
  let peak = idleRss;
  const sampler = setInterval(() => (peak = Math.max(peak, rssKb())), 50);
  const form = new FormData();
  form.set('tempUnit', 'C');
  form.set('rainUnit', 'mm');
  form.set('file', await openAsBlob(file, { type: 'text/csv' }), 'national-year.csv');
  const t1 = performance.now();
  const res = await fetch(`${base}/api/weather/uploads`, { method: 'POST', body: form, headers: { cookie } });
  const created = (await res.json()) as { id: string };
  const tUploaded = performance.now();
  let state: { status: string; rowsAccepted: number; rowsFlagged: number; rowsRejected: number; message: string | null } = { status: 'processing' } as never;
  while (state.status === 'processing') {
    await new Promise((r) => setTimeout(r, 50));
    state = await (await fetch(`${base}/api/weather/uploads/${created.id}`, { headers: { cookie } })).json() as typeof state;
  }
  const intakeSeconds = (performance.now() - t1) / 1000;
  clearInterval(sampler);
  const plainRate = ROWS / plainSeconds;
  const intakeRate = ROWS / intakeSeconds;
  console.log(`plain COPY into a bare table: ${plainSeconds.toFixed(2)} s = ${Math.round(plainRate).toLocaleString('en')} rows/s`);
  console.log(`HTTP intake (upload + checks + load): ${intakeSeconds.toFixed(2)} s = ${Math.round(intakeRate).toLocaleString('en')} rows/s` +
    ` (sending ${((tUploaded - t1) / 1000).toFixed(2)} s, checking and loading ${((performance.now() - tUploaded) / 1000).toFixed(2)} s)`);
  if (stagesMs) console.log(`server stages (ms): ${Object.entries(stagesMs).map(([k, v]) => `${k} ${v}`).join(', ')}`);
  console.log(`result: ${state.status}, accepted ${state.rowsAccepted}, flagged ${state.rowsFlagged}, rejected ${state.rowsRejected}${state.message ? ` — ${state.message}` : ''}`);
  console.log(`ratio intake / plain: ${(intakeRate / plainRate).toFixed(2)} (goal ≥ 0.5: ${intakeRate / plainRate >= 0.5 ? 'met' : 'NOT met'})`);
  console.log(`server RSS: idle ${(idleRss / 1024).toFixed(0)} MB, peak ${(peak / 1024).toFixed(0)} MB (file ${(bytes / 1e6).toFixed(0)} MB)`);
  console.log(JSON.stringify({ rows: ROWS, bytes, plainSeconds, intakeSeconds, plainRate: Math.round(plainRate), intakeRate: Math.round(intakeRate), idleRssMb: Math.round(idleRss / 1024), peakRssMb: Math.round(peak / 1024), status: state.status }));
} finally {
  child.kill('SIGTERM');
  await new Promise((r) => child.once('exit', r));
  rmSync(file, { force: true });
  await db.end();
}
