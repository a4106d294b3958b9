/**
 * Fast on a field phone (issue 20): Broodcast in Debian's Chromium at 360 × 740 (touch), over the network
 * and CPU of a low-end phone on a slow mobile network, set through the Chrome DevTools Protocol as the
 * browser's developer tools define their "Fast 3G" preset: Network.emulateNetworkConditions with
 * 1.6 Mbit/s down and 750 kbit/s up (each × 0.9, as the preset applies it), latency 150 ms × 3.75 = 562.5 ms,
 * and Emulation.setCPUThrottlingRate 4. Against the real server (server/main.ts, as `npm start` runs it)
 * serving a production build of the client, with its own database (broodcast_bench_phone on the dev cluster,
 * the invented demo region loaded, re-created each run). It measures, cold (a fresh profile, no service
 * worker, empty cache) and warm (the service worker installed):
 *   - initial JavaScript of the sign-in page and of the Ladder: gzip bytes (each file's .gz as built, or
 *     gzip -9) of what the screen needs before it can show, read from the build (see `initialJs`);
 *   - the Ladder opened cold by a signed-in person (navigation → first district row);
 *   - the sign-in page: navigation start → the e-mail field visible;
 *   - the Ladder after signing in: the e-mail and password typed a key every 150 ms, then the click on
 *     "Sign in" → the first ranked district row visible;
 *   - bytes over the network (encoded, headers included) from the sign-in page's navigation to the Ladder
 *     with its map, until the network has been quiet for a second;
 *   - warm start: with the service worker installed, a new visit to the sign-in page → the e-mail field.
 * Every figure is printed beside its goal and beside the same figure for the client and static serving
 * before the change ("before": the build of BEFORE_REF, served uncompressed with a one-hour cache as the
 * server did then — static files and index.html from a small peer server here, /api passed to the same
 * real server, only the board compressed). Times are the median of --runs runs.
 * Run: npm run bench:phone   (options: --runs 3 --quick (1 run) --no-before --before-ref REF --no-build --verbose)
 * The last line of the output is one JSON object with every figure (read by bench/run-all.ts).
 */
import 'reflect-metadata';
import express from 'express';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium, type Browser, type BrowserContext, type CDPSession, type Page } from 'playwright-core';
import { build } from 'vite';
import { DEMO_PASSWORD } from '../sample/demo-region';
import { drillDatabase, freePort, isQuick, option, pool, printFigures, projectDir, serverEnv, sleep, startServer } from './drills/drill-lib';

/** The last commit before issue 20's change: its client, served as the server served it then, is "before". */
const DEFAULT_BEFORE_REF = '54ea3f33131b1123d55093ad5c61400f4c06d592';
const RUNS = isQuick() ? 1 : option('runs', 3);
const argValue = (name: string) => (process.argv.includes(`--${name}`) ? process.argv[process.argv.indexOf(`--${name}`) + 1] : null);
const WITH_BEFORE = !process.argv.includes('--no-before');
const BEFORE_REF = argValue('before-ref') ?? DEFAULT_BEFORE_REF;
const EMAIL = 'officer@halvern.example';
/** A key every 150 ms: a quick thumb on a phone keyboard (about 5.5 s for the e-mail and password). */
const TYPING_MS = 150;

/** DevTools' "Fast 3G" preset (its throughputs are 90 % of the nominal 1.6 Mbit/s and 750 kbit/s). */
const FAST_3G = { offline: false, latency: 150 * 3.75, downloadThroughput: ((1.6 * 1000 * 1000) / 8) * 0.9, uploadThroughput: ((750 * 1000) / 8) * 0.9 };
const CPU_SLOWDOWN = 4;
const GOALS = { signInJsKb: 100, ladderJsKb: 150, coldSignInS: 3, ladderAfterSignInS: 2, warmStartS: 1, coldBytesKb: 350 };
/** What issue 20 reported before the change, on the same profile. */
const ISSUE_BEFORE = { signInJsKb: 313, coldSignInS: 8.0, ladderAfterSignInS: 2.1, coldBytesKb: 1000 };

const work = path.join(projectDir, '.local', 'bench', 'phone');
mkdirSync(work, { recursive: true });

// ---- the two clients
async function buildClient(root: string, outDir: string) {
  const t0 = performance.now();
  await build({ root, configFile: path.join(root, 'vite.config.ts'), logLevel: 'error', build: { outDir, emptyOutDir: true } });
  console.log(`built ${path.relative(projectDir, root) || '.'} → ${path.relative(projectDir, outDir)} in ${((performance.now() - t0) / 1000).toFixed(0)} s`);
}

const afterDir = path.join(work, 'after');
if (!process.argv.includes('--no-build') || !existsSync(path.join(afterDir, 'index.html'))) await buildClient(projectDir, afterDir);

let beforeDir: string | null = null;
let beforeNote = '';
if (WITH_BEFORE) {
  const src = path.join(work, 'before-src');
  const dir = path.join(work, 'before');
  try {
    execFileSync('git', ['cat-file', '-e', `${BEFORE_REF}^{commit}`], { cwd: projectDir, stdio: 'ignore' });
    if (process.argv.includes('--no-build') && existsSync(path.join(dir, 'index.html'))) beforeDir = dir;
    else {
      // The old client's sources inside the project, so its imports resolve to this checkout's node_modules.
      rmSync(src, { recursive: true, force: true });
      mkdirSync(src, { recursive: true });
      const tar = execFileSync('git', ['archive', BEFORE_REF, 'index.html', 'public', 'src', 'shared', 'vite.config.ts', 'tsconfig.json', 'package.json'], { cwd: projectDir, maxBuffer: 1 << 30 });
      execFileSync('tar', ['-x', '-C', src], { input: tar });
      await buildClient(src, dir);
      beforeDir = dir;
    }
  } catch (error) {
    beforeNote = `the client of ${BEFORE_REF.slice(0, 10)} could not be built (${(error as Error).message.split('\n')[0]}); "before" shows the figures reported in issue 20`;
    console.log(beforeNote);
  }
}

// ---- the server and its database
const { url, jwtSecret } = await drillDatabase('broodcast_bench_phone', { seedDemo: true });
const port = await freePort();
const server = await startServer(serverEnv(url, jwtSecret, port, { SEASON_RUN_ON_START: 'true', CLIENT_DIST: afterDir, SIGN_IN_LIMIT_PER_ADDRESS: '100000' }));
// The start-up season run gives the Ladder its tiers.
{
  const db = pool(url);
  for (let i = 0; i < 900; i++) {
    const [{ running, tiers }] = (await db.query(
      `SELECT (SELECT count(*)::int FROM season_runs WHERE status = 'running') AS running, (SELECT count(*)::int FROM district_tiers) AS tiers`)).rows;
    if (running === 0 && tiers > 0) break;
    await sleep(200);
  }
  await db.end();
}

/**
 * The peer for "before": the old build served as the server served it before the change — express.static
 * with a one-hour cache, nothing compressed, index.html for client routes — and /api passed to the real
 * server with only the board compressed (the one answer the old server compressed).
 */
async function startBeforePeer(dir: string) {
  const upstream = new URL(server.base);
  const app = express();
  app.use('/api', (req, res) => {
    const headers = { ...req.headers };
    if (!req.originalUrl.startsWith('/api/board')) headers['accept-encoding'] = 'identity';
    const up = http.request({ host: upstream.hostname, port: upstream.port, method: req.method, path: req.originalUrl, headers }, (r) => {
      res.writeHead(r.statusCode ?? 502, r.headers);
      r.pipe(res);
    });
    up.on('error', () => res.destroy());
    req.pipe(up);
  });
  app.use(express.static(dir, {
    index: false,
    maxAge: '1h',
    setHeaders: (res, file) => {
      if (/[\\/](sw\.js|manifest\.webmanifest)$/.test(file)) res.setHeader('Cache-Control', 'no-cache');
    },
  }));
  app.use((req, res, next) => (req.method === 'GET' && req.accepts('html') ? res.sendFile('index.html', { root: dir }) : next()));
  const srv = app.listen(await freePort(), '127.0.0.1');
  await new Promise((r) => srv.once('listening', r));
  return { base: `http://127.0.0.1:${(srv.address() as AddressInfo).port}`, close: () => new Promise((r) => srv.close(r)) };
}

// ---- the browser
const browser: Browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
});
const phone = { viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, locale: 'en-GB' };

interface Traffic { bytes: number; inFlight: Set<string>; lastActivity: number; log: { url: string; bytes: number; at: number }[] }
const VERBOSE = process.argv.includes('--verbose');

/** A throttled page with a record of its traffic (CDP Network events: every request the page makes). */
async function throttledPage(context: BrowserContext): Promise<{ page: Page; cdp: CDPSession; traffic: Traffic }> {
  const page = await context.newPage();
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', FAST_3G);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });
  const traffic: Traffic = {
    bytes: 0, inFlight: new Set(), lastActivity: performance.now(), log: [],
  };
  const started = performance.now();
  const urls = new Map<string, string>();
  cdp.on('Network.requestWillBeSent', (e) => {
    urls.set(e.requestId, e.request.url);
    traffic.inFlight.add(e.requestId);
    traffic.lastActivity = performance.now();
  });
  cdp.on('Network.loadingFinished', (e) => {
    traffic.bytes += e.encodedDataLength;
    traffic.log.push({ url: urls.get(e.requestId) ?? '?', bytes: e.encodedDataLength, at: performance.now() - started });
    traffic.inFlight.delete(e.requestId);
    traffic.lastActivity = performance.now();
  });
  cdp.on('Network.loadingFailed', (e) => {
    traffic.inFlight.delete(e.requestId);
    traffic.lastActivity = performance.now();
  });
  return { page, cdp, traffic };
}

async function networkQuiet(traffic: Traffic, quietMs = 1000, capMs = 30_000) {
  const until = performance.now() + capMs;
  while (performance.now() < until) {
    if (traffic.inFlight.size === 0 && performance.now() - traffic.lastActivity >= quietMs) return;
    await sleep(50);
  }
}

/** gzip bytes of scripts by path, from the build (its .gz when there is one, else gzip -9 of the file). */
function gzipBytes(dir: string, paths: Iterable<string>): number {
  let total = 0;
  for (const p of paths) {
    const file = path.join(dir, decodeURIComponent(p));
    if (!existsSync(file)) continue;
    total += existsSync(`${file}.gz`) ? statSync(`${file}.gz`).size : gzipSync(readFileSync(file), { level: 9 }).length;
  }
  return total;
}

/**
 * The initial JavaScript of a screen, read from the build: the entry script of index.html, the screen's
 * route chunks, the text chunks it loads at once (English here), and every chunk these import statically,
 * transitively. Chunks fetched later by a dynamic import (the region map's chart library, other screens)
 * are not part of it, even when the browser happens to request them before the screen has painted.
 */
function initialJs(dir: string, routeChunks: string[], namespaces: string[]): { files: string[]; gzip: number } {
  const assets = readdirSync(path.join(dir, 'assets'));
  const entry = /<script type="module"[^>]*src="\/([^"]+)"/.exec(readFileSync(path.join(dir, 'index.html'), 'utf8'))![1];
  const starts = [entry, ...routeChunks.flatMap((name) => assets.filter((f) => f.startsWith(`${name}-`) && f.endsWith('.js')).map((f) => `assets/${f}`))];
  starts.push(...namespaces.flatMap((ns) => assets.filter((f) => f.startsWith(`texts-en-${ns}-`) && f.endsWith('.js')).map((f) => `assets/${f}`)));
  const seen = new Set<string>();
  const stack = [...starts];
  while (stack.length) {
    const file = stack.pop()!;
    if (seen.has(file) || !existsSync(path.join(dir, file))) continue;
    seen.add(file);
    const code = readFileSync(path.join(dir, file), 'utf8');
    // Static imports only: `import{a as b}from"./x.js"` and `import"./x.js"`, never `import("./x.js")`.
    for (const m of code.matchAll(/\bimport\s*(?:[^"'();]*?from\s*)?["'](\.\.?\/[^"']+\.js)["']/g))
      stack.push(path.posix.join(path.posix.dirname(file), m[1]));
  }
  return { files: [...seen], gzip: gzipBytes(dir, [...seen].map((f) => `/${f}`)) };
}

const emailField = (page: Page) => page.locator('input[type="email"]').first();
const ladderRow = (page: Page) => page.locator('.ladder-table tbody tr[data-district]').first();

interface Run { signInJs: number; signInS: number; ladderAfterSignInS: number; coldBytes: number; ladderJs: number; ladderDirectS: number; warmStartS: number; warmBytes: number }

async function measureOnce(base: string, dir: string): Promise<Run> {
  // Cold: a fresh profile with the service worker kept out, so every byte comes over the throttled network.
  const cold = await browser.newContext({ ...phone, serviceWorkers: 'block' });
  const { page, traffic } = await throttledPage(cold);
  let t0 = performance.now();
  await page.goto(`${base}/sign-in`, { waitUntil: 'commit' });
  await emailField(page).waitFor({ state: 'visible', timeout: 120_000 });
  const signInS = (performance.now() - t0) / 1000;
  const signInJs = initialJs(dir, ['sign-in.page'], ['common', 'app', 'components', 'auth']).gzip;
  // Typed as a person types on a phone (TYPING_MS a key), during which the Ladder is preloaded.
  await page.locator('input[type="email"]').pressSequentially(EMAIL, { delay: TYPING_MS });
  await page.locator('input[type="password"]').pressSequentially(DEMO_PASSWORD, { delay: TYPING_MS });
  t0 = performance.now();
  await page.locator('form button[type="submit"]').first().click();
  await ladderRow(page).waitFor({ state: 'visible', timeout: 120_000 });
  const ladderAfterSignInS = (performance.now() - t0) / 1000;
  await networkQuiet(traffic);
  const coldBytes = traffic.bytes;
  if (VERBOSE) for (const r of traffic.log) console.log(`  ${(r.at / 1000).toFixed(2).padStart(6)} s ${String(r.bytes).padStart(8)} B ${new URL(r.url).pathname}`);
  const cookies = await cold.cookies();
  await cold.close();

  // Cold, signed in: a person opening the app at the Ladder (initial JavaScript of the Ladder).
  const direct = await browser.newContext({ ...phone, serviceWorkers: 'block' });
  await direct.addCookies(cookies);
  const d = await throttledPage(direct);
  t0 = performance.now();
  await d.page.goto(`${base}/`, { waitUntil: 'commit' });
  await ladderRow(d.page).waitFor({ state: 'visible', timeout: 120_000 });
  const ladderDirectS = (performance.now() - t0) / 1000;
  const ladderJs = initialJs(dir, ['app-layout', 'ladder.page'], ['common', 'app', 'components', 'cautions', 'districts', 'help', 'ladder', 'region-map']).gzip;
  await direct.close();

  // Warm: the service worker installed by a first visit, then a new visit to the sign-in page.
  const warm = await browser.newContext(phone);
  const first = await warm.newPage();
  await first.goto(`${base}/sign-in`);
  await emailField(first).waitFor();
  await first.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await first.reload();
  await first.waitForFunction(() => !!navigator.serviceWorker.controller, undefined, { timeout: 60_000 });
  await first.close();
  const w = await throttledPage(warm);
  t0 = performance.now();
  await w.page.goto(`${base}/sign-in`, { waitUntil: 'commit' });
  await emailField(w.page).waitFor({ state: 'visible', timeout: 60_000 });
  const warmStartS = (performance.now() - t0) / 1000;
  const warmBytes = w.traffic.bytes;
  await warm.close();
  return { signInJs, signInS, ladderAfterSignInS, coldBytes, ladderJs, ladderDirectS, warmStartS, warmBytes };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];

async function measure(name: string, base: string, dir: string) {
  const runs: Run[] = [];
  for (let i = 0; i < RUNS; i++) {
    const r = await measureOnce(base, dir);
    console.log(`${name} run ${i + 1}/${RUNS}: sign-in ${r.signInS.toFixed(2)} s (${(r.signInJs / 1000).toFixed(0)} kB JS gz), Ladder after sign-in ${r.ladderAfterSignInS.toFixed(2)} s, ` +
      `${(r.coldBytes / 1000).toFixed(0)} kB over the network; Ladder opened ${r.ladderDirectS.toFixed(2)} s (${(r.ladderJs / 1000).toFixed(0)} kB JS gz); warm start ${r.warmStartS.toFixed(2)} s (${(r.warmBytes / 1000).toFixed(1)} kB)`);
    runs.push(r);
  }
  const pick = (k: keyof Run) => median(runs.map((r) => r[k]));
  return {
    signInJsKb: pick('signInJs') / 1000, ladderJsKb: pick('ladderJs') / 1000, coldSignInS: pick('signInS'), ladderAfterSignInS: pick('ladderAfterSignInS'),
    ladderDirectS: pick('ladderDirectS'), warmStartS: pick('warmStartS'), warmBytesKb: pick('warmBytes') / 1000, coldBytesKb: pick('coldBytes') / 1000,
  };
}

/** The service worker's precache: every URL listed in sw.js, and their total size on disk. */
function precacheOf(dir: string) {
  const sw = readFileSync(path.join(dir, 'sw.js'), 'utf8');
  const urls = [...new Set([...sw.matchAll(/url:"([^"]+)"/g)].map((m) => m[1]))];
  const bytes = urls.reduce((n, u) => n + (existsSync(path.join(dir, u)) ? statSync(path.join(dir, u)).size : 0), 0);
  return { files: urls.length, bytes, compressedListed: urls.filter((u) => /\.(br|gz)$/.test(u)).length };
}

let after: Awaited<ReturnType<typeof measure>>;
let before: Awaited<ReturnType<typeof measure>> | null = null;
try {
  after = await measure('after', server.base, afterDir);
  if (beforeDir) {
    const peer = await startBeforePeer(beforeDir);
    try {
      before = await measure('before', peer.base, beforeDir);
    } finally {
      await peer.close();
    }
  }
} finally {
  await browser.close();
  await server.kill('SIGTERM');
}

const precache = precacheOf(afterDir);
const precacheBefore = beforeDir ? precacheOf(beforeDir) : null;
const rows = [
  { key: 'signInJsKb', label: 'initial JS, sign-in (kB gzip)', goal: `≤ ${GOALS.signInJsKb}`, ok: after.signInJsKb <= GOALS.signInJsKb, digits: 0 },
  { key: 'ladderJsKb', label: 'initial JS, Ladder (kB gzip)', goal: `≤ ${GOALS.ladderJsKb}`, ok: after.ladderJsKb <= GOALS.ladderJsKb, digits: 0 },
  { key: 'coldSignInS', label: 'cold sign-in page (s)', goal: `< ${GOALS.coldSignInS}`, ok: after.coldSignInS < GOALS.coldSignInS, digits: 2 },
  { key: 'ladderAfterSignInS', label: 'Ladder after signing in (s)', goal: `< ${GOALS.ladderAfterSignInS}`, ok: after.ladderAfterSignInS < GOALS.ladderAfterSignInS, digits: 2 },
  { key: 'warmStartS', label: 'warm start from the service worker (s)', goal: `< ${GOALS.warmStartS}`, ok: after.warmStartS < GOALS.warmStartS, digits: 2 },
  { key: 'coldBytesKb', label: 'bytes over the network, cold sign-in to Ladder (kB)', goal: `≤ ${GOALS.coldBytesKb}`, ok: after.coldBytesKb <= GOALS.coldBytesKb, digits: 0 },
  { key: 'ladderDirectS', label: 'Ladder opened cold, signed in (s)', goal: '—', ok: null, digits: 2 },
] as const;
console.log(`\nFast 3G (${FAST_3G.latency} ms, ${(FAST_3G.downloadThroughput * 8 / 1e6).toFixed(2)} Mbit/s down, ${(FAST_3G.uploadThroughput * 8 / 1e3).toFixed(0)} kbit/s up), CPU ×${CPU_SLOWDOWN}, 360 × 740; median of ${RUNS} run(s)`);
console.log(`before: ${before ? `the client of ${BEFORE_REF.slice(0, 10)} served as before the change, measured in this run` : beforeNote || 'not measured (--no-before)'}; issue 20 reported ${ISSUE_BEFORE.coldSignInS} s, ${ISSUE_BEFORE.ladderAfterSignInS} s, ~${ISSUE_BEFORE.coldBytesKb} kB, ${ISSUE_BEFORE.signInJsKb} kB JS`);
console.log('\n| figure | now | goal | before | met |\n|---|---|---|---|---|');
for (const r of rows) {
  const now = (after[r.key] as number).toFixed(r.digits);
  const then = before ? (before[r.key] as number).toFixed(r.digits) : (ISSUE_BEFORE as Record<string, number>)[r.key]?.toString() ?? '—';
  console.log(`| ${r.label} | ${now} | ${r.goal} | ${then} | ${r.ok === null ? '—' : r.ok ? 'yes' : 'no'} |`);
}
console.log(`\nService-worker precache: ${precache.files} files, ${(precache.bytes / 1e6).toFixed(2)} MB (before: ${precacheBefore ? `${precacheBefore.files} files, ${(precacheBefore.bytes / 1e6).toFixed(2)} MB` : '—'}); .br/.gz listed: ${precache.compressedListed}`);
printFigures({ runs: RUNS, beforeRef: before ? BEFORE_REF : null, goals: GOALS, issueBefore: ISSUE_BEFORE, after, before, precache, precacheBefore });
process.exit(0);
