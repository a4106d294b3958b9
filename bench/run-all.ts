/**
 * `npm run bench`: every benchmark of the project, one after another on this machine — the season model,
 * the weather intake, the board (season runs and the Ladder's API), the fault drills, the load and the field
 * phone (the client over a throttled network and CPU) — then one
 * Markdown report (bench/report.md) with each figure beside its floor or bare peer measured in the same
 * run, their ratio, the goal and whether it was met, plus the machine and the date.
 *   npm run bench                 full sizes (several minutes of both cores: run it on a quiet machine)
 *   npm run bench -- --quick      small sizes (model 500 districts, intake 500 stations, board 200 districts,
 *                                 fewer drill repetitions, 10 s of load) for a quick look
 *   npm run bench -- --only model,drills   a subset (model, intake, board, drills, load, phone, national); --out FILE elsewhere
 * Each benchmark runs in its own process; its figures are the JSON object on the last line of its output.
 */
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { startDevDatabase } from '../scripts/lib/dev-database';
import { runScript } from './drills/run-drills';

const here = path.dirname(fileURLToPath(import.meta.url));
const args = process.argv.slice(2);
const QUICK = args.includes('--quick');
const value = (name: string) => (args.includes(`--${name}`) ? args[args.indexOf(`--${name}`) + 1] : null);
const only = value('only')?.split(',') ?? null;
const out = path.resolve(value('out') ?? path.join(here, 'report.md'));
const want = (name: string) => !only || only.includes(name);

type Figures = Record<string, any>;
interface Row { benchmark: string; figure: string; peer: string; ratio: string; goal: string; met: string }
const rows: Row[] = [];
const notes: string[] = [];
const fmt = (n: number, digits = 0) => (Number.isFinite(n) ? n.toLocaleString('en', { maximumFractionDigits: digits, minimumFractionDigits: digits }) : '—');
const yes = (ok: boolean) => (ok ? 'yes' : '**no**');
const sizeNote = QUICK ? ' (quick size: goal is for the full size)' : '';

async function run(name: string, file: string, argv: string[], env: Record<string, string> = {}) {
  console.log(`\n##### ${name}: tsx ${path.relative(process.cwd(), file)} ${argv.join(' ')}`);
  const r = await runScript(file, argv, { ...process.env, ...env });
  if (r.error) notes.push(`${name}: the script ${r.error} after ${r.seconds.toFixed(0)} s.`);
  return { ...r, figures: r.figures as Figures | null };
}

// ---- model
if (want('model')) {
  const r = await run('model', path.join(here, 'model.bench.ts'), QUICK ? ['--districts', '500'] : []);
  const f = r.figures;
  if (f?.singleThread && f?.floor) {
    const judged = !QUICK;
    rows.push({
      benchmark: `season model (${fmt(f.districts)} districts × ${f.days} days × ${f.profiles?.length ?? '?'} profiles)`,
      figure: `1 thread ${fmt(f.singleThread.seconds, 3)} s (${fmt(f.singleThread.daysPerSecond)} days/s)`,
      peer: `bare loop ${fmt(f.floor.seconds, 4)} s`, ratio: `${fmt(f.singleThread.seconds / f.floor.seconds, 1)}× the floor's time`,
      goal: '< 2 s for 5,000 districts', met: judged ? yes(f.singleThread.seconds < 2) : `— ${sizeNote.trim()}`,
    });
    rows.push({
      benchmark: 'season model, worker threads', figure: `${f.workers.count} workers ${fmt(f.workers.wallSeconds, 3)} s wall`,
      peer: `1 thread ${fmt(f.singleThread.seconds, 3)} s`, ratio: `speed-up ${fmt(f.singleThread.seconds / f.workers.wallSeconds, 2)}×`,
      goal: '< 2 s for 5,000 districts', met: judged ? yes(f.workers.wallSeconds < 2) : '—',
    });
  } else notes.push('model: no figures read from its last line.');
}

// ---- intake
if (want('intake')) {
  const r = await run('intake', path.join(here, 'intake.bench.ts'), QUICK ? ['--stations', '500'] : []);
  const f = r.figures;
  if (f?.plainRate && f?.intakeRate) {
    rows.push({
      benchmark: `weather intake over HTTP (${fmt(f.rows)} rows, ${fmt(f.bytes / 1e6, 1)} MB)`,
      figure: `${fmt(f.intakeRate)} rows/s (${f.status}), peak RSS ${fmt(f.peakRssMb)} MB`, peer: `plain COPY ${fmt(f.plainRate)} rows/s`,
      ratio: fmt(f.intakeRate / f.plainRate, 2), goal: '≥ 0.5 of plain COPY', met: yes(f.intakeRate / f.plainRate >= 0.5),
    });
  } else notes.push('intake: no figures read from its last line.');
}

// ---- board
if (want('board')) {
  const districts = QUICK ? 200 : 5000;
  const r = await run('board', path.join(here, 'board.bench.ts'), [], { BENCH_DISTRICTS: String(districts), BENCH_DURATION: QUICK ? '5' : '30' });
  const f = r.figures?.season ? fromBoardJson(r.figures) : parseBoardText(r.output);
  if (!r.figures?.season) notes.push('board: its last line is not the expected JSON; the figures were read from its text lines (bench/board.bench.ts).');
  if (f) {
    const judged = !QUICK;
    if (f.fullSeconds !== undefined)
      rows.push({ benchmark: `season run, full (${fmt(districts)} districts)`, figure: `${fmt(f.fullSeconds, 1)} s`, peer: '—', ratio: '—', goal: '< 60 s for 5,000 districts', met: judged ? yes(f.fullSeconds < 60) : '—' });
    if (f.incrementalSeconds !== undefined)
      rows.push({ benchmark: 'season run, incremental (1 % changed)', figure: `${fmt(f.incrementalSeconds, 1)} s`, peer: `full run ${fmt(f.fullSeconds, 1)} s`, ratio: fmt(f.incrementalSeconds / f.fullSeconds, 2), goal: '< 10 s', met: judged ? yes(f.incrementalSeconds < 10) : '—' });
    for (const h of f.http ?? []) {
      const ratio = h.rps / h.bareRps;
      const goal = h.connections === 50 ? `≥ ${f.ratioGoal} of bare; no errors` : h.connections === 10 ? `p99 ≤ ${f.p99Goal} ms; no errors` : 'no errors';
      const ok = h.errors === 0 && (h.connections === 50 ? ratio >= f.ratioGoal : h.connections === 10 ? h.p99 <= f.p99Goal : true);
      rows.push({
        benchmark: `GET /api/board${h.encoding ? ` (${h.encoding})` : ''}, ${h.connections} connections`, figure: `${fmt(h.rps)} req/s, p99 ${h.p99} ms, errors ${h.errors}`,
        peer: `bare Express ${fmt(h.bareRps)} req/s, p99 ${h.bareP99} ms`, ratio: fmt(ratio, 2), goal, met: judged ? yes(ok) : h.errors === 0 ? '— (no errors)' : '**no** (errors)',
      });
    }
  } else notes.push('board: no figures found.');
}

// ---- drills
if (want('drills')) {
  const r = await run('drills', path.join(here, 'drills', 'run-drills.ts'), QUICK ? ['--quick'] : []);
  const f = r.figures ?? {};
  for (const [op, label] of [['weather', 'weather upload'], ['cases', 'case upload'], ['season', 'season run']] as const) {
    const k = f.kill?.[op];
    if (!k) { notes.push(`drills: no figures for the SIGKILL during a ${label}.`); continue; }
    rows.push({
      benchmark: `SIGKILL during a ${label} ×${k.kills}`,
      figure: `seen after each kill: ${k.seen.join(', ')}; in between: ${k.inBetween}${op === 'season' ? ' districts' : ''}; next run completed ${k.nextRunCompleted}/${k.kills}`,
      peer: '—', ratio: '—', goal: 'never in between; next run completes', met: yes(k.inBetween === 0 && k.nextRunCompleted === k.kills),
    });
  }
  const d = f.databaseDown;
  if (d && d.requests !== undefined)
    rows.push({
      benchmark: `PostgreSQL stopped ${d.downSeconds} s ×${d.outages}`,
      figure: `${d.answered503}/${d.requests} answers 503 database_unavailable, slowest ${d.slowestMs} ms; 200 again ${d.resumeSeconds} s after it returned`,
      peer: '—', ratio: '—', goal: 'every answer 503 with a message; resumes by itself', met: yes(d.answered503 === d.requests && d.resumeSeconds < 30),
    });
  else notes.push('drills: no figures for the database outage.');
  const m = f.mailDown;
  if (m && m.queued !== undefined)
    rows.push({
      benchmark: `mail server stopped ${m.downSeconds} s during a bulletin send`,
      figure: `${m.queued} messages; ${m.arrivedBeforeStop} before the stop; delivered ${m.delivered}, lost ${m.lost}, sent twice ${m.sentTwice}, failed ${m.outbox?.failed}`,
      peer: '—', ratio: '—', goal: 'nothing lost, nothing sent twice', met: yes(m.lost === 0 && m.sentTwice === 0 && m.outbox?.failed === 0),
    });
  else notes.push('drills: no figures for the mail-server outage.');
}

// ---- load
if (want('load')) {
  const r = await run('load', path.join(here, 'load.bench.ts'), QUICK ? ['--quick'] : []);
  const f = r.figures;
  if (f?.broodcast) {
    const b = f.broodcast;
    const p = f.bare;
    const bad = b.errors + b.non2xx + b.timeouts;
    rows.push({
      benchmark: `load: ${f.sessions} sessions × ${f.durationSeconds} s (Ladder, District file, case entry)`,
      figure: `${fmt(b.requestsPerSecond)} req/s, p50 ${b.p50} ms, p99 ${b.p99} ms, errors + non-2xx ${bad}`,
      peer: `bare Express ${fmt(p.requestsPerSecond)} req/s, p99 ${p.p99} ms`, ratio: `${fmt(f.ratioThroughput, 2)} of its throughput; p99 ${fmt(f.ratioP99, 1)}×`,
      goal: 'no errors; p99 recorded', met: yes(bad === 0),
    });
    for (const [k, label] of [['board', 'GET /api/board'], ['file', 'GET /api/districts/:id/file'], ['entry', 'PUT /api/districts/:id/cases']] as const)
      rows.push({
        benchmark: `load: ${label}`, figure: `${fmt(b.perRoute[k].requests)} requests, p50 ${b.perRoute[k].p50} ms, p99 ${b.perRoute[k].p99} ms, non-2xx ${b.perRoute[k].non2xx}`,
        peer: `bare p99 ${p.perRoute[k].p99} ms`, ratio: `p99 ${fmt(b.perRoute[k].p99 / Math.max(0.1, p.perRoute[k].p99), 1)}×`, goal: 'no errors', met: yes(b.perRoute[k].non2xx === 0),
      });
  } else notes.push('load: no figures read from its last line.');
}

// ---- the field phone
if (want('phone')) {
  const r = await run('phone', path.join(here, 'phone.bench.ts'), QUICK ? ['--quick'] : []);
  const f = r.figures;
  if (f?.after) {
    const a = f.after;
    const b = f.before;
    const g = f.goals;
    const was = (k: string, digits: number, unit: string) => (b ? `before ${fmt(b[k], digits)} ${unit}` : `issue 20: ${f.issueBefore?.[k] ?? '—'} ${unit}`);
    const ratio = (k: string) => (b && b[k] ? `${fmt(a[k] / b[k], 2)} of before` : '—');
    const line = (label: string, k: string, digits: number, unit: string, goal: string, ok: boolean) =>
      rows.push({ benchmark: `field phone (Fast 3G, CPU ×4): ${label}`, figure: `${fmt(a[k], digits)} ${unit}`, peer: was(k, digits, unit), ratio: ratio(k), goal, met: yes(ok) });
    line('initial JS, sign-in', 'signInJsKb', 0, 'kB gzip', `≤ ${g.signInJsKb} kB`, a.signInJsKb <= g.signInJsKb);
    line('initial JS, Ladder', 'ladderJsKb', 0, 'kB gzip', `≤ ${g.ladderJsKb} kB`, a.ladderJsKb <= g.ladderJsKb);
    line('cold sign-in page', 'coldSignInS', 2, 's', `< ${g.coldSignInS} s`, a.coldSignInS < g.coldSignInS);
    line('Ladder after signing in', 'ladderAfterSignInS', 2, 's', `< ${g.ladderAfterSignInS} s`, a.ladderAfterSignInS < g.ladderAfterSignInS);
    line('warm start (service worker)', 'warmStartS', 2, 's', `< ${g.warmStartS} s`, a.warmStartS < g.warmStartS);
    line('bytes, cold sign-in to Ladder', 'coldBytesKb', 0, 'kB', `≤ ${g.coldBytesKb} kB`, a.coldBytesKb <= g.coldBytesKb);
    if (f.precache) notes.push(`phone: the service worker precaches ${f.precache.files} files, ${fmt(f.precache.bytes / 1e6, 2)} MB (docs/offline.md).`);
  } else notes.push('phone: no figures read from its last line.');
}

// ---- a country at national scale (issue 17, item 5): import, stations and weather, the map's answer, the District file
if (want('national')) {
  const r = await run('national', path.join(here, 'national.bench.ts'), QUICK ? ['--districts', '500', '--days', '60', '--duration', '5'] : []);
  const f = r.figures;
  if (f?.importSeconds !== undefined) {
    const judged = !QUICK;
    const load = `load ${fmt(f.loadStart, 1)}→${fmt(f.loadEnd, 1)}`;
    rows.push({ benchmark: `district import, dry run (${fmt(f.districts)} polygons, ${fmt(f.counties)} us-atlas counties + synthetic, ${fmt(f.fileMb, 1)} MB)`, figure: `${fmt(f.drySeconds, 1)} s (${load})`, peer: `JSON.parse of the file ${fmt(f.parseSeconds, 2)} s`, ratio: `${fmt(f.drySeconds / f.parseSeconds, 0)}×`, goal: '< 60 s', met: judged ? yes(f.drySeconds < 60) : '—' });
    rows.push({ benchmark: `district import, real (${fmt(f.created)} created, ${fmt(f.problems)} refused)`, figure: `${fmt(f.importSeconds, 1)} s; stages ms ${Object.entries(f.importStages ?? {}).map(([k, v]) => `${k} ${v}`).join(', ')}`, peer: `JSON.parse ${fmt(f.parseSeconds, 2)} s`, ratio: `${fmt(f.importSeconds / f.parseSeconds, 0)}×`, goal: '< 60 s', met: judged ? yes(f.importSeconds < 60) : '—' });
    rows.push({ benchmark: `weather upload into ${fmt(f.districts)} districts (${fmt(f.stations)} stations, ${fmt(f.weatherRows)} rows, ${fmt(f.seriesDays)} series days)`, figure: `${fmt(f.weatherSeconds, 1)} s (${fmt(f.weatherRows / f.weatherSeconds)} rows/s)`, peer: '—', ratio: '—', goal: 'recorded (the 1,825,000-row goal is bench:intake)', met: '—' });
    rows.push({ benchmark: `re-upload of ${fmt(f.reuploadRows)} unchanged rows into ${fmt(f.districts)} districts`, figure: `${fmt(f.reuploadSeconds, 2)} s end to end`, peer: `first upload ${fmt(f.weatherSeconds, 1)} s`, ratio: fmt(f.reuploadSeconds / f.weatherSeconds, 2), goal: '< 5 s', met: judged ? yes(f.reuploadSeconds < 5) : '—' });
    rows.push({ benchmark: `GET /api/districts/boundaries (${fmt(f.districts)} districts)`, figure: `${fmt(f.boundariesBytes / 1e6, 2)} MB ${f.boundariesEncoding} in ${fmt(f.boundariesSeconds, 2)} s`, peer: `${fmt(f.boundariesIdentityBytes / 1e6, 2)} MB unpacked`, ratio: fmt(f.boundariesBytes / f.boundariesIdentityBytes, 2), goal: '≤ 1 MB gzip', met: judged ? yes(f.boundariesEncoding === 'gzip' && f.boundariesBytes <= 1e6) : '—' });
    const b = f.file?.broodcast;
    const p = f.file?.bare;
    if (b && p) rows.push({ benchmark: 'GET /api/districts/:id/file, 50 connections, random districts', figure: `${fmt(b.rps)} req/s, p50 ${b.p50} ms, p99 ${b.p99} ms, errors ${b.errors + b.non2xx}`, peer: `bare node:http, same bytes: ${fmt(p.rps)} req/s, p99 ${p.p99} ms`, ratio: `p99 ${fmt(b.p99 / Math.max(1, p.p99), 1)}×`, goal: 'p99 < 250 ms', met: judged ? yes(b.p99 < 250) : '—' });
  } else notes.push('national: no figures read from its last line.');
}

// ---- the report
const machine = await describeMachine();
const md = [
  '# Broodcast benchmark report',
  '',
  `${new Date().toISOString().replace('T', ' ').slice(0, 16)} UTC · ${QUICK ? '**quick sizes** (`npm run bench -- --quick`): the goals are for the full sizes' : 'full sizes (`npm run bench`)'}${only ? ` · only: ${only.join(', ')}` : ''}`,
  '',
  `Machine: ${machine.cpu}, ${machine.cores} cores, ${machine.ramGb} GB RAM · Node ${process.version} · ${machine.postgres} · ${os.type()} ${os.release()}`,
  '',
  'Each figure is measured beside its floor or bare peer in the same run, on the same machine. Reproduce with `npm run bench`',
  '(or `npm run bench -- --quick`); each line also has its own command: `npm run bench:model`, `bench:intake`, `bench:board`,',
  '`bench:drills`, `bench:load`, `bench:phone`, `bench:national`. Each drill says what it does at the top of its script in bench/drills/; the fuzz tests run with `npm test`.',
  '',
  '| benchmark | figure | floor / peer | ratio | goal | met? |',
  '|---|---|---|---|---|---|',
  ...rows.map((r) => `| ${[r.benchmark, r.figure, r.peer, r.ratio, r.goal, r.met].map((c) => c.replace(/\|/g, '\\|')).join(' | ')} |`),
  '',
  ...(notes.length ? ['Notes:', '', ...notes.map((n) => `- ${n}`), ''] : []),
].join('\n');
writeFileSync(out, md);
console.log(`\n${md}\nReport written to ${path.relative(process.cwd(), out)}`);
process.exit(0);

/** The board benchmark's last line: { season: {...}, board: { rows: [{ endpoint, encoding, connections, rps, p99, errors }], goals } }. */
function fromBoardJson(j: Figures): Figures {
  const http: Figures[] = [];
  const rowsIn: Figures[] = j.board?.rows ?? [];
  for (const a of rowsIn.filter((x) => x.endpoint.startsWith('Broodcast'))) {
    const b = rowsIn.find((x) => !x.endpoint.startsWith('Broodcast') && x.encoding === a.encoding && x.connections === a.connections);
    if (b) http.push({ encoding: a.encoding, connections: a.connections, rps: a.rps, p99: a.p99, errors: a.errors, bareRps: b.rps, bareP99: b.p99 });
  }
  return {
    fullSeconds: j.season.fullRunSeconds, idleSeconds: j.season.incrementalUnchangedSeconds, incrementalSeconds: j.season.incrementalChangedSeconds, http,
    ratioGoal: j.board?.goals?.throughputRatioAt50 ?? 0.5, p99Goal: j.board?.goals?.p99At10Ms ?? 100,
  };
}

/** The board benchmark's text lines, when its last line is not JSON. */
function parseBoardText(text: string): Figures | null {
  const full = /Season run: full ([\d.]+) s/.exec(text);
  const inc = /([\d.]+) s unchanged, ([\d.]+) s with 1 % changed/.exec(text);
  const http: Figures[] = [];
  for (const c of ['10', '50']) {
    const a = new RegExp(`^\\| Broodcast GET /api/board \\| ${c} \\| (\\d+) \\| ([\\d.]+) \\| ([\\d.]+) \\| (\\d+) \\|`, 'm').exec(text);
    const b = new RegExp(`^\\| bare Express, same payload \\| ${c} \\| (\\d+) \\| ([\\d.]+) \\| ([\\d.]+) \\| (\\d+) \\|`, 'm').exec(text);
    if (a && b) http.push({ connections: Number(c), rps: Number(a[1]), p99: Number(a[3]), errors: Number(a[4]), bareRps: Number(b[1]), bareP99: Number(b[3]) });
  }
  if (!full && !http.length) return null;
  return { fullSeconds: full ? Number(full[1]) : undefined, idleSeconds: inc ? Number(inc[1]) : undefined, incrementalSeconds: inc ? Number(inc[2]) : undefined, http, ratioGoal: 0.5, p99Goal: 100 };
}

async function describeMachine() {
  let postgres = 'PostgreSQL ?';
  try {
    const { url } = await startDevDatabase();
    const c = new pg.Client({ connectionString: url });
    await c.connect();
    postgres = `PostgreSQL ${(await c.query('SHOW server_version')).rows[0].server_version}`;
    await c.end();
  } catch {
    try { postgres = execFileSync('/usr/lib/postgresql/15/bin/postgres', ['--version'], { encoding: 'utf8' }).trim(); } catch { /* unknown */ }
  }
  return { cpu: os.cpus()[0]?.model.trim() ?? 'unknown CPU', cores: os.availableParallelism(), ramGb: (os.totalmem() / 2 ** 30).toFixed(1), postgres };
}
