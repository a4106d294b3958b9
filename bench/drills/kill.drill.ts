/**
 * Fault drill: SIGKILL the server during a weather upload, a case upload and a season run (ten times
 * each by default). After each kill the drill counts the rows the operation writes: they must equal
 * either the count before the operation or the count after it completes, never something in between.
 * Then it starts a new server, runs the same operation again and checks that it completes.
 *
 * The season run is atomic per district by design (docs/tier.md: one transaction per district), so its
 * check is per district: each district holds either its old results or the new ones, whole; the next
 * (incremental) run then does exactly the districts the killed run left undone.
 *
 * Each operation has its own database on the dev cluster (broodcast_drill_kill_*), re-created per run.
 * Run: npm run --silent bench:drills -- --only kill   or   tsx bench/drills/kill.drill.ts [--quick] [--repeat N]
 * The last line of the output is one JSON object with the figures.
 */
import 'reflect-metadata';
import { hashPassword } from '../../server/auth/passwords';
import { PROFILE_IDS } from '../../shared/model';
import {
  countRows, drillDatabase, freePort, isQuick, option, pool, printFigures, sameCounts, serverEnv, signIn, sleep, startServer,
  type DrillServer, waitForOpenTransaction,
} from './drill-lib';

const QUICK = isQuick();
const REPEAT = option('repeat', QUICK ? 3 : 10);
const PASSWORD = 'drill-password-42';
const todayIso = () => new Date().toISOString().slice(0, 10);

/** What the counts showed right after a kill; the season run's "k/N new" means k districts whole from the killed run, the rest whole from before. */
type Seen = 'before' | 'after' | 'in-between' | `${number}/${number} new`;
interface OperationFigures {
  kills: number;
  seen: Seen[];
  inBetween: number;
  nextRunCompleted: number;
  rowsBefore: number;
  rowsAfter: number;
  detail?: Record<string, unknown>;
}

function classify(atKill: Record<string, number>, before: Record<string, number>, after: Record<string, number>): Seen {
  if (sameCounts(atKill, before)) return 'before';
  if (sameCounts(atKill, after)) return 'after';
  return 'in-between';
}
const total = (c: Record<string, number>) => Object.values(c).reduce((a, b) => a + b, 0);

// ---------------------------------------------------------------- weather upload
async function weatherDrill(): Promise<OperationFigures> {
  const STATIONS = option('stations', QUICK ? 250 : 400);
  const { url, jwtSecret } = await drillDatabase('broodcast_drill_kill_weather');
  const db = pool(url);
  await db.query(
    `INSERT INTO weather_stations (code, name, latitude, longitude) SELECT 'D-' || i, 'Drill ' || i, -40 + i * 0.01, -70 FROM generate_series(1, $1) i`,
    [STATIONS],
  );
  await db.query(`INSERT INTO users (email, display_name, role, password_hash) VALUES ('officer@drill.example', 'Drill officer', 'officer', $1)`, [await hashPassword(PASSWORD, 4)]);
  const tables = ['weather_observations', 'weather_observation_revisions', 'district_weather_days', 'weather_upload_issues', 'audit_events'] as const;
  const port = await freePort();
  const env = serverEnv(url, jwtSecret, port, { WEATHER_UPLOAD_STALE_SECONDS: '2' });

  const file = (year: number) => {
    const days = (Date.UTC(year + 1, 0, 1) - Date.UTC(year, 0, 1)) / 86_400_000;
    const lines = ['station,date,tmin,tmax,rh,rain'];
    for (let s = 1; s <= STATIONS; s++)
      for (let d = 0; d < days; d++) {
        const date = new Date(Date.UTC(year, 0, 1 + d)).toISOString().slice(0, 10);
        lines.push(`D-${s},${date},${10 + (d % 5)},${20 + (d % 7)},${50 + (d % 9)},${d % 3}`);
      }
    return `${lines.join('\n')}\n`;
  };
  const upload = async (base: string, cookie: string, body: string) => {
    const form = new FormData();
    form.set('tempUnit', 'C');
    form.set('file', new Blob([body], { type: 'text/csv' }), 'drill.csv');
    const res = await fetch(`${base}/api/weather/uploads`, { method: 'POST', body: form, headers: { cookie } });
    const json = (await res.json()) as { id: string; status: string };
    if (res.status !== 201) throw new Error(`upload answered ${res.status}: ${JSON.stringify(json)}`);
    return json.id;
  };
  const status = async (id: string) =>
    (await db.query('SELECT status, rows_processed FROM weather_uploads WHERE id = $1', [id])).rows[0] as { status: string; rows_processed: number };

  const seen: Seen[] = [];
  const killedStatus: string[] = [];
  let completed = 0;
  let server: DrillServer = await startServer(env);
  let cookie = await signIn(server.base, 'officer@drill.example', PASSWORD);
  const first = await countRows(db, tables);
  let last = first;
  try {
    for (let i = 0; i < REPEAT; i++) {
      const body = file(2000 + i);
      const before = await countRows(db, tables);
      const id = await upload(server.base, cookie, body);
      // Kill once the load is under way (the heartbeat reports rows), at a varying point after that.
      for (let k = 0; k < 400 && (await status(id)).rows_processed === 0 && (await status(id)).status === 'processing'; k++) await sleep(25);
      await sleep(Math.floor(Math.random() * 1200));
      server.child.kill('SIGKILL');
      await server.exited;
      await sleep(200);
      const atKill = await countRows(db, tables);

      server = await startServer(env);
      cookie = await signIn(server.base, 'officer@drill.example', PASSWORD);
      await sleep(2100); // past WEATHER_UPLOAD_STALE_SECONDS: reading the upload sweeps it
      const killed = (await (await fetch(`${server.base}/api/weather/uploads/${id}`, { headers: { cookie } })).json()) as { status: string };
      killedStatus.push(killed.status);
      const again = await upload(server.base, cookie, body);
      let s = await status(again);
      for (let k = 0; k < 1200 && s.status === 'processing'; k++) {
        await sleep(100);
        s = await status(again);
      }
      if (s.status === 'done') completed++;
      const after = await countRows(db, tables);
      seen.push(classify(atKill, before, after));
      last = after;
    }
  } finally {
    await server.kill('SIGKILL');
    await db.end();
  }
  const figures: OperationFigures = {
    kills: REPEAT, seen, inBetween: seen.filter((s) => s === 'in-between').length, nextRunCompleted: completed,
    rowsBefore: total(first), rowsAfter: total(last),
    detail: { rowsPerUpload: STATIONS * 365, killedUploadStatus: killedStatus },
  };
  report('weather upload', figures, `killed uploads afterwards: [${killedStatus.join(', ')}]`);
  return figures;
}

// ---------------------------------------------------------------- case upload
async function casesDrill(): Promise<OperationFigures> {
  const DISTRICTS = 50;
  const WEEKS = option('weeks', QUICK ? 20 : 30);
  const { url, jwtSecret } = await drillDatabase('broodcast_drill_kill_cases');
  const db = pool(url);
  await db.query(`INSERT INTO districts (code, name) SELECT 'K-' || lpad(i::text, 3, '0'), 'Drill district ' || i FROM generate_series(1, $1) i`, [DISTRICTS]);
  await db.query(`INSERT INTO case_district_settings (district_id, active_from) SELECT id, '2000-01-01' FROM districts`);
  const [{ id: epiId }] = (await db.query(
    `INSERT INTO users (email, display_name, role, password_hash) VALUES ('epi@drill.example', 'Drill epidemiologist', 'epidemiologist', $1) RETURNING id`,
    [await hashPassword(PASSWORD, 4)],
  )).rows;
  await db.query(`INSERT INTO user_districts (user_id, district_id) SELECT $1, id FROM districts`, [epiId]);
  await db.query(`INSERT INTO diseases (code, name) SELECT 'DRILL-' || i, 'Drill disease ' || i FROM generate_series(0, $1) i`, [REPEAT]);
  const tables = ['case_counts', 'case_count_revisions', 'audit_events'] as const;
  const port = await freePort();
  const env = serverEnv(url, jwtSecret, port);
  const file = (disease: number) => {
    const lines = ['district,year,week,disease,cases'];
    for (let d = 1; d <= DISTRICTS; d++)
      for (let w = 1; w <= WEEKS; w++) lines.push(`K-${String(d).padStart(3, '0')},2025,${w},DRILL-${disease},${(d * 7 + w * 3) % 40}`);
    return `${lines.join('\n')}\n`;
  };
  const upload = async (base: string, cookie: string, body: string) => {
    const form = new FormData();
    form.set('file', new Blob([body], { type: 'text/csv' }), 'drill-cases.csv');
    const res = await fetch(`${base}/api/cases/uploads`, { method: 'POST', body: form, headers: { cookie } });
    return { status: res.status, body: (await res.json()) as { accepted?: boolean; created?: number; unchanged?: number } };
  };

  const seen: Seen[] = [];
  const outcomes: string[] = [];
  let completed = 0;
  let server: DrillServer = await startServer(env);
  let cookie = await signIn(server.base, 'epi@drill.example', PASSWORD);
  // A first upload (disease 0) times the operation, so the kills can land inside it.
  const t0 = performance.now();
  const warm = await upload(server.base, cookie, file(0));
  let duration = performance.now() - t0;
  let inside = 0;
  if (warm.status !== 200) throw new Error(`case upload answered ${warm.status}: ${JSON.stringify(warm.body)}`);
  const first = await countRows(db, tables);
  let last = first;
  try {
    for (let i = 1; i <= REPEAT; i++) {
      const body = file(i);
      const before = await countRows(db, tables);
      const pending = upload(server.base, cookie, body).catch(() => null);
      // Kill inside the upload's transaction, at a point that moves from its start towards its end.
      inside += (await waitForOpenTransaction(db, duration * (0.05 + (0.6 * (i - 1)) / Math.max(1, REPEAT - 1)))) ? 1 : 0;
      server.child.kill('SIGKILL');
      await server.exited;
      await pending;
      await sleep(200);
      const atKill = await countRows(db, tables);
      server = await startServer(env);
      cookie = await signIn(server.base, 'epi@drill.example', PASSWORD);
      const t1 = performance.now();
      const again = await upload(server.base, cookie, body);
      duration = performance.now() - t1;
      if (again.status === 200 && again.body.accepted) completed++;
      outcomes.push(again.body.created ? `created ${again.body.created}` : `unchanged ${again.body.unchanged}`);
      const after = await countRows(db, tables);
      seen.push(classify(atKill, before, after));
      last = after;
    }
  } finally {
    await server.kill('SIGKILL');
    await db.end();
  }
  const figures: OperationFigures = {
    kills: REPEAT, seen, inBetween: seen.filter((s) => s === 'in-between').length, nextRunCompleted: completed,
    rowsBefore: total(first), rowsAfter: total(last),
    detail: { rowsPerUpload: DISTRICTS * WEEKS, uploadSeconds: +(duration / 1000).toFixed(2), killedInsideTransaction: inside, nextRun: outcomes },
  };
  report('case upload', figures, `an upload of ${DISTRICTS * WEEKS} rows takes ${(duration / 1000).toFixed(2)} s; killed inside its transaction: ${inside}/${REPEAT}; next runs: [${outcomes.join(', ')}]`);
  return figures;
}

// ---------------------------------------------------------------- season run
async function seasonDrill(): Promise<OperationFigures> {
  const N = option('districts', 200);
  const { url, jwtSecret } = await drillDatabase('broodcast_drill_kill_season');
  const db = pool(url);
  const today = todayIso();
  await db.query(
    `INSERT INTO districts (code, name, centroid_lat, centroid_lon)
     SELECT 'S-' || lpad(i::text, 4, '0'), 'Drill district ' || i, 5 + (i % 100) * 0.35, 10 + (i / 100) * 0.5 FROM generate_series(1, $1) AS i`, [N]);
  await db.query(`INSERT INTO district_profiles (district_id, profile_id) SELECT d.id, p FROM districts d, unnest($1::text[]) AS p`, [PROFILE_IDS]);
  await db.query(
    `INSERT INTO district_weather_days (district_id, date, tmin, tmax, rh, rain, filled, station_count)
     SELECT d.id, day::date,
            22 - (d.centroid_lat - 5) * 0.4 + 7 * sin(2 * pi() * (extract(doy FROM day) - 110) / 365) + (hashtext(d.code || day::text) % 100) / 50.0,
            31 - (d.centroid_lat - 5) * 0.4 + 7 * sin(2 * pi() * (extract(doy FROM day) - 110) / 365) + (hashtext(day::text || d.code) % 100) / 50.0,
            65, 3, false, 1
       FROM districts d, generate_series(make_date(extract(year FROM $1::date)::int - 3, 1, 1), $1::date, interval '1 day') AS day`, [today]);
  const [disease] = (await db.query(`INSERT INTO diseases (code, name) VALUES ('DRILL', 'Drill disease') RETURNING id`)).rows;
  await db.query(
    `INSERT INTO case_counts (district_id, disease_id, epi_year, epi_week, cases, reported_at, updated_at)
     SELECT d.id, $1, y, w, abs(hashtext(d.code || y || w)) % 12, now(), now()
       FROM districts d, generate_series(extract(year FROM now())::int - 6, extract(year FROM now())::int - 1) AS y, generate_series(1, 48) AS w`, [disease.id]);
  await db.query(`INSERT INTO users (email, display_name, role, password_hash) VALUES ('officer@drill.example', 'Drill officer', 'officer', $1)`, [await hashPassword(PASSWORD, 4)]);
  await db.query('ANALYZE');
  const port = await freePort();
  const env = serverEnv(url, jwtSecret, port);

  const startRun = async (base: string, cookie: string, full: boolean) => {
    const res = await fetch(`${base}/api/season-runs`, { method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: JSON.stringify({ full }) });
    const body = (await res.json()) as { id: string };
    if (res.status !== 202) throw new Error(`season run answered ${res.status}: ${JSON.stringify(body)}`);
    return body.id;
  };
  const waitRun = async (id: string) => {
    for (let k = 0; k < 3000; k++) {
      const [r] = (await db.query(`SELECT status, districts_total, districts_done FROM season_runs WHERE id = $1`, [id])).rows;
      if (r.status !== 'running') return r as { status: string; districts_total: number; districts_done: number };
      await sleep(100);
    }
    throw new Error('the season run did not finish');
  };
  /** Per district: whose run its state and tier belong to, and how many vector-clock days it holds (all profiles). */
  const perDistrict = async () =>
    (await db.query(
      `SELECT d.id, s.run_id AS state_run, s.fingerprint,
              (SELECT t.run_id FROM district_tiers t WHERE t.district_id = d.id ORDER BY t.epi_year DESC, t.epi_week DESC LIMIT 1) AS tier_run,
              (SELECT coalesce(sum(v.days), 0)::int FROM vector_clock_seasons v WHERE v.district_id = d.id) AS clock_rows
         FROM districts d LEFT JOIN district_run_state s ON s.district_id = d.id`,
    )).rows as { id: string; state_run: string | null; fingerprint: string | null; tier_run: string | null; clock_rows: number }[];

  let server: DrillServer = await startServer(env);
  let cookie = await signIn(server.base, 'officer@drill.example', PASSWORD);
  const t0 = performance.now();
  const warmId = await startRun(server.base, cookie, true);
  const warm = await waitRun(warmId);
  const duration = performance.now() - t0;
  if (warm.status !== 'succeeded') throw new Error(`the first season run ended ${warm.status}`);
  const expectedRows = new Map((await perDistrict()).map((d) => [d.id, d.clock_rows]));
  const rowsFirst = [...expectedRows.values()].reduce((a, b) => a + b, 0);

  const seen: Seen[] = [];
  const doneAtKill: number[] = [];
  const nextDid: number[] = [];
  let inBetweenDistricts = 0;
  let completed = 0;
  let rowsLast = rowsFirst;
  try {
    for (let i = 0; i < REPEAT; i++) {
      // New inputs for every district (yesterday's weather a little warmer), so the incremental run redoes them all.
      await db.query(`UPDATE district_weather_days SET tmax = tmax + 0.1 WHERE date = $1::date - 1`, [today]);
      const before = new Map((await perDistrict()).map((d) => [d.id, d.state_run]));
      const runId = await startRun(server.base, cookie, false);
      // Kill part-way, at a share of the districts that moves from the start of the run towards its end.
      const share = 0.1 + (0.75 * i) / Math.max(1, REPEAT - 1);
      for (let k = 0; k < 6000; k++) {
        const [r] = (await db.query(`SELECT status, districts_done FROM season_runs WHERE id = $1`, [runId])).rows;
        if (r.status !== 'running' || r.districts_done >= Math.ceil(share * N)) break;
        await sleep(5);
      }
      server.child.kill('SIGKILL');
      await server.exited;
      await sleep(200);
      const atKill = await perDistrict();
      let done = 0;
      let between = 0;
      for (const d of atKill) {
        const whole = d.state_run === d.tier_run && d.clock_rows === expectedRows.get(d.id);
        const which = d.state_run === runId ? 'after' : d.state_run === before.get(d.id) ? 'before' : 'other';
        if (!whole || which === 'other') between++;
        else if (which === 'after') done++;
      }
      inBetweenDistricts += between;
      doneAtKill.push(done);
      seen.push(between > 0 ? 'in-between' : done === 0 ? 'before' : done === atKill.length ? 'after' : `${done}/${atKill.length} new`);
      server = await startServer(env);
      cookie = await signIn(server.base, 'officer@drill.example', PASSWORD);
      const next = await waitRun(await startRun(server.base, cookie, false));
      nextDid.push(next.districts_done);
      const afterNext = await perDistrict();
      const allWhole = afterNext.every((d) => d.state_run === d.tier_run && d.clock_rows === expectedRows.get(d.id) && d.state_run !== before.get(d.id));
      if (next.status === 'succeeded' && next.districts_done === atKill.length - done && allWhole) completed++;
      rowsLast = afterNext.reduce((a, d) => a + d.clock_rows, 0);
    }
  } finally {
    await server.kill('SIGKILL');
    await db.end();
  }
  const figures: OperationFigures = {
    kills: REPEAT, seen, inBetween: inBetweenDistricts, nextRunCompleted: completed, rowsBefore: rowsFirst, rowsAfter: rowsLast,
    detail: { districts: N, runSeconds: +(duration / 1000).toFixed(2), districtsDoneAtKill: doneAtKill, nextRunDistricts: nextDid },
  };
  report('season run', figures,
    `${N} districts, a run takes ${(duration / 1000).toFixed(1)} s; districts whole from the killed run: [${doneAtKill.join(', ')}], ` +
    `the next run did: [${nextDid.join(', ')}]; districts in between: ${inBetweenDistricts}`);
  return figures;
}

function report(name: string, f: OperationFigures, extra: string) {
  console.log(
    `${name} SIGKILL ×${f.kills}: rows before=${f.rowsBefore.toLocaleString('en')}, after-complete=${f.rowsAfter.toLocaleString('en')}, ` +
    `seen after each kill: [${f.seen.join(', ')}], in-between: ${f.inBetween}; next run completed: ${f.nextRunCompleted}/${f.kills}`,
  );
  console.log(`  ${extra}`);
}

const only = process.argv.includes('--op') ? process.argv[process.argv.indexOf('--op') + 1] : null;
const figures: Record<string, OperationFigures> = {};
if (!only || only === 'weather') figures.weather = await weatherDrill();
if (!only || only === 'cases') figures.cases = await casesDrill();
if (!only || only === 'season') figures.season = await seasonDrill();
printFigures({ drill: 'kill', repeat: REPEAT, ...figures });
process.exit(0);
