/**
 * Benchmark of a country at national scale (issue 17, item 5), through the HTTP endpoints of a real server
 * process on its own database (broodcast_national, re-created from the migrations each run):
 *  1. import of 5,000 real-shaped polygons (`POST /api/districts/import`), dry run and real: the 3,231
 *     counties of the us-atlas package (counties-10m.json: the US Census Bureau's cartographic boundary
 *     files, public domain, packaged by Mike Bostock under the ISC licence) with their states as regions,
 *     plus a deterministic jittered grid of synthetic districts for the rest (in the Atlantic, east of the
 *     coast, so it overlaps no county). Peer: parsing the same file with JSON.parse (the floor of any import).
 *  2. stations (one per 10 districts, `POST /api/weather/stations/import`) and a year of their weather
 *     (`POST /api/weather/uploads`), so the districts have sources and series; then a re-upload of 3,000
 *     unchanged rows, timed end to end (goal < 5 s). Peer: the first upload's rate.
 *  3. the region map's answer (`GET /api/districts/boundaries`) gzip size (goal ≤ 1 MB) and time.
 *  4. `GET /api/districts/:id/file` under 50 connections with autocannon for random districts (goal p99
 *     < 250 ms) beside a bare node:http server answering the same bytes in the same run.
 * The server logs the import's stages (parse, simplify, checks, …); they are printed too.
 * The 72 counties whose quantized boundaries cross themselves are refused by the checks and left out (skipProblems).
 * Run: npm run bench:national   (options: --districts N (default 5000), --days N (default 365), --duration S (default 15))
 * Its figures are the JSON object on its last line (bench/run-all.ts reads them).
 */
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import { createServer } from 'node:net';
import os from 'node:os';
import { createInterface } from 'node:readline';
import { gzipSync } from 'node:zlib';
import autocannon from 'autocannon';
import bcrypt from 'bcryptjs';
import type { Feature, FeatureCollection, Polygon, MultiPolygon } from 'geojson';
import pg from 'pg';
import { feature as topoFeature } from 'topojson-client';
import type { Topology } from 'topojson-specification';
import { startDevDatabase, projectDir } from '../scripts/lib/dev-database';
import { migrate } from '../scripts/lib/prepare-database';

const option = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
};
const DISTRICTS = option('districts', 5000);
const DAYS = option('days', 365);
const DURATION = option('duration', 15);
const loadStart = os.loadavg()[0];

// ---- the boundary file
type Poly = Feature<Polygon | MultiPolygon, Record<string, unknown>>;
/** us-atlas counties as GeoJSON, with their state (the region) and a population derived from the area (synthetic). */
function counties(): Poly[] {
  const topo = JSON.parse(readFileSync(`${projectDir}/node_modules/us-atlas/counties-10m.json`, 'utf8')) as Topology;
  const states = new Map((topoFeature(topo, topo.objects.states) as unknown as FeatureCollection).features.map((f) => [String(f.id), String(f.properties?.name ?? f.id)]));
  const fc = topoFeature(topo, topo.objects.counties) as unknown as FeatureCollection<Polygon | MultiPolygon>;
  return fc.features.map((f) => ({
    type: 'Feature', geometry: f.geometry,
    properties: { code: `US-${f.id}`, name: String(f.properties?.name ?? f.id), state: `US-${String(f.id).slice(0, 2)}`, stateName: states.get(String(f.id).slice(0, 2)) ?? String(f.id).slice(0, 2) },
  }));
}
/** Deterministic pseudo-random in [0, 1) from integers (a hash: the same edge gives the same wiggle in both cells). */
const hash = (...xs: number[]) => {
  let h = 2166136261;
  for (const x of xs) h = Math.imul(h ^ (x + 0x9e3779b9), 16777619) >>> 0;
  return (Math.imul(h ^ (h >>> 15), 2246822507) >>> 0) / 2 ** 32;
};
/** A jittered grid of `n` cells of 0.2°, each edge with 6 wiggled points shared by its two cells. */
function grid(n: number): Poly[] {
  const side = Math.ceil(Math.sqrt(n));
  const size = 0.2;
  const lon0 = -72;
  const lat0 = 25;
  const vertex = (i: number, j: number): [number, number] => [lon0 + i * size + (hash(i, j, 1) - 0.5) * size * 0.3, lat0 + j * size + (hash(i, j, 2) - 0.5) * size * 0.3];
  const edge = (a: [number, number], b: [number, number], key: number[]): [number, number][] => {
    const pts: [number, number][] = [];
    const steps = 7;
    for (let k = 1; k < steps; k++) {
      const t = k / steps;
      const w = (hash(...key, k) - 0.5) * size * 0.08;
      pts.push([a[0] + (b[0] - a[0]) * t - (b[1] - a[1]) * w, a[1] + (b[1] - a[1]) * t + (b[0] - a[0]) * w]);
    }
    return pts;
  };
  const out: Poly[] = [];
  for (let c = 0; c < n; c++) {
    const i = c % side;
    const j = Math.floor(c / side);
    const [p00, p10, p11, p01] = [vertex(i, j), vertex(i + 1, j), vertex(i + 1, j + 1), vertex(i, j + 1)];
    // Edges keyed by their lower-left vertex and direction, walked counter-clockwise (reversed where shared the other way).
    const bottom = edge(p00, p10, [i, j, 10]);
    const right = edge(p10, p11, [i + 1, j, 11]);
    const top = edge(p01, p11, [i, j + 1, 10]).reverse();
    const left = edge(p00, p01, [i, j, 11]).reverse();
    const ring = [p00, ...bottom, p10, ...right, p11, ...top, p01, ...left, p00].map(([x, y]) => [Math.round(x * 1e5) / 1e5, Math.round(y * 1e5) / 1e5]);
    const region = `SYN-${Math.floor(j / 10)}`;
    out.push({ type: 'Feature', geometry: { type: 'Polygon', coordinates: [ring] }, properties: { code: `SYN-${c + 1}`, name: `Synthetic ${c + 1}`, state: region, stateName: `Synthetic region ${Math.floor(j / 10) + 1}` } });
  }
  return out;
}
const real = counties();
const features = [...real.slice(0, DISTRICTS), ...grid(Math.max(0, DISTRICTS - real.length))];
features.forEach((f, i) => (f.properties.population = 1000 + Math.round(hash(i, 7) * 200_000)));
const fileText = JSON.stringify({ type: 'FeatureCollection', features });
console.log(`district file: ${features.length.toLocaleString('en')} features (${Math.min(real.length, DISTRICTS)} us-atlas counties + ${Math.max(0, DISTRICTS - real.length)} synthetic), ${(fileText.length / 1e6).toFixed(1)} MB`);

// ---- the database and the server
const { url: devUrl } = await startDevDatabase();
const benchUrl = devUrl.replace(/\/[^/]+$/, '/broodcast_national');
{
  const c = new pg.Client({ connectionString: devUrl });
  await c.connect();
  await c.query('DROP DATABASE IF EXISTS broodcast_national WITH (FORCE)');
  await c.query('CREATE DATABASE broodcast_national');
  await c.end();
}
await migrate(benchUrl);
const db = new pg.Client({ connectionString: benchUrl });
await db.connect();
const password = 'bench-password-123';
const hashPw = bcrypt.hashSync(password, 4);
for (const [email, role] of [['bench-admin@bench.example', 'admin'], ['bench-officer@bench.example', 'officer']])
  await db.query(`INSERT INTO users (email, display_name, role, password_hash) VALUES ($1, $2, $3, $4)`, [email, `Bench ${role}`, role, hashPw]);

const port = await new Promise<number>((resolve) => {
  const srv = createServer().listen(0, '127.0.0.1', () => {
    const p = (srv.address() as { port: number }).port;
    srv.close(() => resolve(p));
  });
});
const child = spawn(process.execPath, [...(process.env.BENCH_PROF ? ['--cpu-prof', '--cpu-prof-dir=/tmp/prof-national'] : []), '--import', 'tsx', 'server/main.ts'], {
  cwd: projectDir,
  stdio: ['ignore', 'pipe', 'inherit'],
  env: { ...process.env, NODE_ENV: 'development', PORT: String(port), DATABASE_URL: benchUrl, JWT_SECRET: 'bench-secret-that-is-long-enough-for-signing', LOG_LEVEL: 'info', BROODCAST_DEMO: '0' },
});
const stageLogs: { stagesMs: Record<string, number>; dryRun: boolean }[] = [];
let intakeStages: Record<string, number> | null = null;
createInterface({ input: child.stdout! }).on('line', (line) => {
  if (!line.includes(' stages')) return;
  try {
    const j = JSON.parse(line);
    if (j.msg === 'district import stages') stageLogs.push(j);
    if (j.msg === 'weather intake stages') intakeStages = j.stagesMs;
  } catch {
    /* not a JSON log line */
  }
});
process.on('exit', () => child.kill('SIGKILL'));
const base = `http://127.0.0.1:${port}`;
const seconds = (t: number) => (performance.now() - t) / 1000;

async function signIn(email: string) {
  const r = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  await r.text();
  if (!r.ok) throw new Error(`sign-in ${email}: ${r.status}`);
  return r.headers.get('set-cookie')!.split(';')[0];
}
async function post(path: string, cookie: string, form: FormData) {
  const r = await fetch(`${base}${path}`, { method: 'POST', body: form, headers: { cookie } });
  const body = await r.json();
  if (!r.ok) throw new Error(`${path}: ${r.status} ${JSON.stringify(body).slice(0, 500)}`);
  return body;
}
async function upload(cookie: string, csv: string, name: string) {
  const form = new FormData();
  form.set('tempUnit', 'C');
  form.set('rainUnit', 'mm');
  form.set('file', new Blob([csv], { type: 'text/csv' }), name);
  const t = performance.now();
  const created = await post('/api/weather/uploads', cookie, form) as { id: string };
  let state: { status: string; rowsAccepted: number; rowsFlagged: number; rowsRejected: number; message: string | null } = { status: 'processing' } as never;
  while (state.status === 'processing') {
    await new Promise((r) => setTimeout(r, 50));
    state = await (await fetch(`${base}/api/weather/uploads/${created.id}`, { headers: { cookie } })).json() as typeof state;
  }
  return { seconds: seconds(t), state };
}
/** Bytes on the wire and time of a GET, asking for gzip. */
function getRaw(path: string, cookie: string): Promise<{ status: number; bytes: number; encoding: string; seconds: number; body: Buffer }> {
  const t = performance.now();
  return new Promise((resolve, reject) => {
    http.get(`${base}${path}`, { headers: { cookie, 'accept-encoding': 'gzip' } }, (res) => {
      const parts: Buffer[] = [];
      res.on('data', (d: Buffer) => parts.push(d));
      res.on('end', () => {
        const body = Buffer.concat(parts);
        resolve({ status: res.statusCode ?? 0, bytes: body.length, encoding: String(res.headers['content-encoding'] ?? 'identity'), seconds: seconds(t), body });
      });
    }).on('error', reject);
  });
}
function cannon(url: string, headers: Record<string, string>, paths: string[]) {
  let i = 0;
  return autocannon({
    url, connections: 50, duration: DURATION, headers,
    requests: [{ setupRequest: (req: Record<string, unknown>) => ({ ...req, path: paths[i++ % paths.length] }) }],
  } as unknown as autocannon.Options);
}

const figures: Record<string, unknown> = { districts: features.length, counties: Math.min(real.length, DISTRICTS), fileMb: fileText.length / 1e6, loadStart };
try {
  for (let i = 0; i < 300; i++) {
    if (await fetch(`${base}/api/health`).then((r) => r.text().then(() => r.ok), () => false)) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  const admin = await signIn('bench-admin@bench.example');

  // 1. the import
  let t = performance.now();
  JSON.parse(fileText);
  const parseSeconds = seconds(t);
  const importForm = (dry: boolean) => {
    const form = new FormData();
    for (const [k, v] of Object.entries({ codeProperty: 'code', nameProperty: 'name', parentCodeProperty: 'state', parentNameProperty: 'stateName', populationProperty: 'population', populationYear: '2025' })) form.set(k, v);
    form.set('file', new Blob([fileText], { type: 'application/geo+json' }), 'national.geojson');
    return form;
  };
  t = performance.now();
  const dry = await post('/api/districts/import?dryRun=true', admin, importForm(true)) as { created: number; problems: unknown[] };
  const drySeconds = seconds(t);
  t = performance.now();
  const done = await post('/api/districts/import?skipProblems=true', admin, importForm(false)) as { created: number; updated: number; regions: { created: number }; problems: unknown[] };
  const importSeconds = seconds(t);
  console.log(`JSON.parse of the file (floor): ${parseSeconds.toFixed(2)} s`);
  console.log(`import dry run: ${drySeconds.toFixed(1)} s (${dry.created} to create, ${dry.problems.length} problems)`);
  console.log(`import: ${importSeconds.toFixed(1)} s (${done.created} created, ${done.updated} updated, ${done.regions.created} regions, ${done.problems.length} problems)`);
  for (const s of stageLogs) console.log(`  server stages${s.dryRun ? ' (dry run)' : ''} (ms): ${Object.entries(s.stagesMs).map(([k, v]) => `${k} ${v}`).join(', ')}`);
  Object.assign(figures, { parseSeconds, drySeconds, importSeconds, created: done.created, problems: done.problems.length, importStages: stageLogs.find((s) => !s.dryRun)?.stagesMs ?? null, dryStages: stageLogs.find((s) => s.dryRun)?.stagesMs ?? null });

  // 2. stations and weather
  const ids: { id: string; code: string; lon: number; lat: number }[] = (await db.query('SELECT id, code, centroid_lon AS lon, centroid_lat AS lat FROM districts ORDER BY code')).rows;
  const stations = ids.filter((_, i) => i % 10 === 0).map((d, i) => ({ code: `ST${String(i + 1).padStart(4, '0')}`, lon: d.lon, lat: d.lat }));
  {
    const form = new FormData();
    form.set('file', new Blob([`code,name,latitude,longitude,elevation,activeFrom,activeTo\n${stations.map((s) => `${s.code},Station ${s.code},${s.lat.toFixed(5)},${s.lon.toFixed(5)},100,,`).join('\n')}\n`], { type: 'text/csv' }), 'stations.csv');
    t = performance.now();
    await post('/api/weather/stations/import', admin, form);
    figures.stationsSeconds = seconds(t);
    console.log(`stations import: ${stations.length} stations in ${(figures.stationsSeconds as number).toFixed(1)} s`);
  }
  const dates = Array.from({ length: DAYS }, (_, d) => new Date(Date.UTC(2025, 0, 1 + d)).toISOString().slice(0, 10));
  const rowsOf = (list: typeof stations) => list.flatMap((s, k) => dates.map((date, d) => {
    const mean = 20 + (k % 5) + 8 * Math.sin((2 * Math.PI * (d - 110)) / 365) + Math.sin(d / 3.7);
    return `${s.code},${date},${(mean - 5).toFixed(1)},${(mean + 5 + (d % 3) * 0.3).toFixed(1)},${50 + (d % 30)},${(d % 7) * 0.5}`;
  }));
  const officer = await signIn('bench-officer@bench.example');
  const year = rowsOf(stations);
  const first = await upload(officer, `station,date,tmin,tmax,rh,rain\n${year.join('\n')}\n`, 'year.csv');
  console.log(`weather upload: ${year.length.toLocaleString('en')} rows in ${first.seconds.toFixed(1)} s (${first.state.status}, accepted ${first.state.rowsAccepted})`);
  if (intakeStages) console.log(`  server stages (ms): ${Object.entries(intakeStages).map(([k, v]) => `${k} ${v}`).join(', ')}`);
  const firstStages = intakeStages;
  const seriesDays = Number((await db.query('SELECT count(*) FROM district_weather_days')).rows[0].count);
  const again = year.slice(0, 3000);
  intakeStages = null;
  const second = await upload(officer, `station,date,tmin,tmax,rh,rain\n${again.join('\n')}\n`, 'again.csv');
  console.log(`re-upload of ${again.length.toLocaleString('en')} unchanged rows into ${ids.length} districts: ${second.seconds.toFixed(2)} s (${second.state.status})`);
  if (intakeStages) console.log(`  server stages (ms): ${Object.entries(intakeStages).map(([k, v]) => `${k} ${v}`).join(', ')}`);
  // The re-upload's bare peer, in the same run: a plain node:http server that reads the same multipart body,
  // answers 201 and then one poll with "done" — the wire and client floor under the intake's own work.
  let bareReupload: number;
  {
    const peer = http.createServer((req, res) => {
      req.resume();
      req.on('end', () => {
        res.writeHead(req.method === 'POST' ? 201 : 200, { 'content-type': 'application/json' });
        res.end(JSON.stringify(req.method === 'POST' ? { id: 'bare' } : { status: 'done', rowsAccepted: again.length }));
      });
    });
    await new Promise<void>((r) => peer.listen(0, '127.0.0.1', () => r()));
    const peerBase = `http://127.0.0.1:${(peer.address() as { port: number }).port}`;
    const form = new FormData();
    form.set('tempUnit', 'C');
    form.set('rainUnit', 'mm');
    form.set('file', new Blob([`station,date,tmin,tmax,rh,rain\n${again.join('\n')}\n`], { type: 'text/csv' }), 'again.csv');
    const t0 = performance.now();
    await (await fetch(`${peerBase}/api/weather/uploads`, { method: 'POST', body: form })).json();
    await new Promise((r) => setTimeout(r, 50)); // the same first poll wait as upload()
    await (await fetch(`${peerBase}/api/weather/uploads/bare`)).json();
    bareReupload = seconds(t0);
    peer.close();
    console.log(`  bare peer (node:http reading the same body, one poll): ${bareReupload.toFixed(3)} s`);
  }
  Object.assign(figures, { bareReuploadSeconds: bareReupload, reuploadStages: intakeStages, weatherStages: firstStages });
  Object.assign(figures, { stations: stations.length, weatherRows: year.length, weatherSeconds: first.seconds, weatherStatus: first.state.status, seriesDays, reuploadRows: again.length, reuploadSeconds: second.seconds, reuploadStatus: second.state.status });

  // 3. the region map's answer
  const b = await getRaw('/api/districts/boundaries', admin);
  const identityBytes = b.encoding === 'gzip' ? (await import('node:zlib')).gunzipSync(b.body).length : b.bytes;
  const gzipFloor = gzipSync(b.encoding === 'gzip' ? (await import('node:zlib')).gunzipSync(b.body) : b.body).length;
  console.log(`GET /api/districts/boundaries: ${b.status}, ${(b.bytes / 1e6).toFixed(2)} MB ${b.encoding} (${(identityBytes / 1e6).toFixed(2)} MB unpacked) in ${b.seconds.toFixed(2)} s`);
  Object.assign(figures, { boundariesStatus: b.status, boundariesBytes: b.bytes, boundariesEncoding: b.encoding, boundariesIdentityBytes: identityBytes, boundariesSeconds: b.seconds, boundariesGzipLevel6Bytes: gzipFloor });

  // 4. the District file under 50 connections, beside a bare server answering the same bytes
  const paths = ids.map((d) => `/api/districts/${d.id}/file`);
  const sample = await getRaw(paths[0], admin);
  const bare = http.createServer((_req, res) => {
    res.writeHead(200, { 'content-type': 'application/json', ...(sample.encoding === 'gzip' ? { 'content-encoding': 'gzip' } : {}) });
    res.end(sample.body);
  });
  await new Promise<void>((r) => bare.listen(0, '127.0.0.1', () => r()));
  const barePort = (bare.address() as { port: number }).port;
  const shuffled = [...paths].sort((x, y) => hash(x.length, x.charCodeAt(20), x.charCodeAt(25)) - hash(y.length, y.charCodeAt(20), y.charCodeAt(25)));
  const rb = await cannon(`${base}`, { cookie: admin, 'accept-encoding': 'gzip' }, shuffled);
  const rp = await cannon(`http://127.0.0.1:${barePort}`, { 'accept-encoding': 'gzip' }, shuffled);
  bare.close();
  const fileFig = (r: autocannon.Result) => ({ rps: Math.round(r.requests.average), p50: r.latency.p50, p99: r.latency.p99, requests: r.requests.total, errors: r.errors + r.timeouts, non2xx: r.non2xx });
  figures.file = { broodcast: fileFig(rb), bare: fileFig(rp), sampleStatus: sample.status, sampleBytes: sample.bytes };
  console.log(`GET /api/districts/:id/file, 50 connections × ${DURATION} s: ${JSON.stringify(fileFig(rb))}; bare node:http, same bytes: ${JSON.stringify(fileFig(rp))}`);
  figures.loadEnd = os.loadavg()[0];
  console.log(`load average (1 min): ${loadStart.toFixed(1)} at the start, ${(figures.loadEnd as number).toFixed(1)} at the end`);
} finally {
  child.kill('SIGTERM');
  await new Promise((r) => child.once('exit', r));
  await db.end();
}
console.log(JSON.stringify(figures));
process.exit(0);
