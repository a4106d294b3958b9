/**
 * `npm start` after scripts/start.sh has made sure of node modules and PostgreSQL's binaries:
 * the dev cluster, migrations, the demo region, the mail catcher, the client build, the server.
 *
 * Stopping: Ctrl-C (SIGINT) or SIGTERM, in any state (while setting up, while running, after the
 * server died), stops everything this process started — the server, the mail catcher, the fake feed,
 * and the cluster only if this process started it (one already running belongs to another command and
 * stays up). A second Ctrl-C while stopping kills the server at once. When the server dies on its own,
 * the start script stops the rest and exits with the server's code. What it started is written to
 * `.local/run/start-<port>.json`, so the next start after a crash stops a server left behind.
 *
 * Options (for its tests and quick restarts): `--no-build` skips the client build, `--no-demo` skips
 * loading the demo region. `BROODCAST_DEMO=0` starts an empty installation (no demo) and prints a one-time
 * link to choose the first admin's password (`BROODCAST_ADMIN_EMAIL` names that admin) until an admin has one.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { clusterRunning, stopCluster, type Cluster } from './lib/cluster';
import { buildClient } from './lib/build-client';
import { projectDir, startDevDatabase } from './lib/dev-database';
import { startMailCatcher } from './lib/mail-catcher';
import { demoWanted } from './lib/demo-flag';
import { migrate, firstAdmin } from './lib/prepare-database';
import { ports } from './lib/ports';
import { isAlive, isOurServer, otherStartUsing, readRunState, removeRunState, stopProcess, writeRunState } from './lib/run-state';
import { DEMO_PASSWORD, DEMO_USERS } from '../sample/demo-region';
import { startFakeFeed } from '../sample/fake-feed';
import { sweepUploadFolders } from '../server/weather/upload-dir';

const args = new Set(process.argv.slice(2));
let withDemo = true;
const started = Date.now();
const cleanups: { what: string; run: () => Promise<void> | void }[] = [];
let child: ChildProcess | null = null;
let childGone = false;
let cluster: Cluster | null = null;
let clusterOurs = false;
let stopping: Promise<never> | null = null;
let inheritCluster = false;
/** The cluster start in progress: a stop during it waits for it, so a cluster this start just started is stopped too. */
let devDatabase: ReturnType<typeof startDevDatabase> | null = null;

/** A stop asked for during set-up: wait here for it (it exits the process) instead of starting the next part. */
async function untilStopped(): Promise<void> {
  if (stopping) await stopping;
}

/** Stop everything this process started, once; a second signal while stopping kills the server outright. */
function stopAll(code: number): Promise<never> {
  if (stopping) {
    if (child && !childGone) child.kill('SIGKILL');
    return stopping;
  }
  stopping = (async () => {
    if (!cluster && devDatabase) {
      const dev = await devDatabase.catch(() => null);
      if (dev) {
        cluster = dev.cluster;
        clusterOurs = dev.cluster.startedHere || inheritCluster;
      }
    }
    if (child && !childGone) {
      // `exit` may already have fired (childGone is set by it); otherwise wait for it, with a bound.
      const gone = new Promise<void>((r) => child!.once('exit', () => r()));
      child.kill('SIGTERM');
      const late = setTimeout(() => child?.kill('SIGKILL'), 10_000);
      await gone;
      clearTimeout(late);
    }
    for (const c of cleanups.reverse()) {
      try {
        await c.run();
      } catch (err) {
        console.error(`› could not stop ${c.what}:`, (err as Error).message);
      }
    }
    if (cluster && clusterOurs) {
      const other = otherStartUsing(projectDir, cluster.dataDir);
      if (other) console.log(`› leaving the PostgreSQL cluster running: the start with pid ${other.startPid} uses it`);
      else if (clusterRunning(cluster)) stopCluster(cluster);
    } else if (cluster) {
      console.log('› leaving the PostgreSQL cluster running: it was running before this start');
    }
    removeRunState(projectDir, ports.app);
    process.exit(code);
  })();
  return stopping;
}
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));
process.on('SIGHUP', () => void stopAll(0));

const saveState = () =>
  writeRunState(projectDir, {
    startPid: process.pid,
    serverPid: child && !childGone ? (child.pid ?? null) : null,
    appPort: ports.app,
    cluster: { dataDir: cluster?.dataDir ?? '', startedHere: clusterOurs },
  });

/** Before anything starts: another live start on this port is an error; a dead one's server is stopped. */
async function recoverFromCrash(): Promise<boolean> {
  const previous = readRunState(projectDir, ports.app);
  if (!previous) return false;
  if (previous.startPid !== process.pid && isAlive(previous.startPid)) {
    console.error(`✗ Broodcast is already running on port ${ports.app} (start script pid ${previous.startPid}). Stop it with Ctrl-C first.`);
    process.exit(1);
  }
  if (previous.serverPid && isAlive(previous.serverPid) && isOurServer(previous.serverPid, projectDir)) {
    console.log(`› stopping the server (pid ${previous.serverPid}) left running by a start that ended without cleaning up`);
    await stopProcess(previous.serverPid);
  }
  removeRunState(projectDir, ports.app);
  return previous.cluster.startedHere; // that start had started the cluster: this one takes it over
}

try {
  inheritCluster = await recoverFromCrash();
  const swept = sweepUploadFolders();
  if (swept.length) console.log(`› removed ${swept.length} upload folder(s) left by stopped servers`);

  devDatabase = startDevDatabase();
  const dev = await devDatabase;
  cluster = dev.cluster;
  clusterOurs = dev.cluster.startedHere || inheritCluster;
  saveState();
  await untilStopped();

  withDemo = demoWanted(process.env, args);
  const { migrations, seeded } = await migrate(dev.url, withDemo ? { seedDemo: { nodeEnv: 'development', bcryptCost: 12 } } : {});
  if (migrations.length) console.log(`› ran ${migrations.length} migration(s)`);
  if (withDemo) console.log(seeded ? '› loaded the invented Halvern Region (demo data)' : '› reusing the data already in the cluster');
  else console.log('› started without the demo region (BROODCAST_DEMO=0)');
  const appUrl = process.env.APP_URL ?? `http://127.0.0.1:${ports.app}`;
  const setup = withDemo ? null : await firstAdmin(dev.url, { appUrl, email: process.env.BROODCAST_ADMIN_EMAIL });
  await untilStopped();

  const maildev = await startMailCatcher(ports.smtp, ports.mailWeb, path.join(projectDir, '.local', 'mail', 'dev'));
  cleanups.push({ what: 'the mail catcher', run: () => maildev.stop() });
  const feedKey = randomBytes(18).toString('base64url');
  const feed = await startFakeFeed({ port: ports.feed, key: feedKey });
  cleanups.push({ what: 'the weather feed', run: () => feed.stop() });
  await untilStopped();

  if (args.has('--no-build')) console.log('› client build skipped (--no-build)');
  else {
    console.log('› building the client');
    await buildClient();
  }
  await untilStopped();

  child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: projectDir,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: {
      ...process.env,
      NODE_ENV: 'development',
      PORT: String(ports.app),
      DATABASE_URL: dev.url,
      JWT_SECRET: process.env.JWT_SECRET ?? dev.secrets.jwtSecret,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(ports.smtp),
      APP_URL: appUrl,
      WEATHER_FEED_URL: process.env.WEATHER_FEED_URL ?? feed.url,
      WEATHER_FEED_KEY: process.env.WEATHER_FEED_KEY ?? feedKey,
      WEATHER_FEED_CRON: process.env.WEATHER_FEED_CRON ?? '*/30 * * * *',
    },
  });
  child.once('exit', (code, signal) => {
    childGone = true;
    if (stopping) return; // stopping already: stopAll is waiting for this
    console.error(`server exited (${signal ?? code})`);
    void stopAll(signal ? 1 : (code ?? 1)); // 0 when it stopped normally (it got the terminal's Ctrl-C too)
  });
  saveState();
  await waitForHealth(`http://127.0.0.1:${ports.app}/api/health`);
  console.log(`
Broodcast is running (set-up took ${((Date.now() - started) / 1000).toFixed(1)} s)
  app:          ${appUrl}
  mail catcher: http://127.0.0.1:${ports.mailWeb}
${signInLines(setup)}
Press Ctrl-C to stop; the data stays for the next start.
`);
} catch (err) {
  if (!stopping) {
    console.error(err instanceof Error ? err.message : err);
    await stopAll(1);
  }
}

/** The banner's sign-in part: the demo's people, or the first admin's one-time link, or nothing to add. */
function signInLines(setup: { link: string; email: string } | null): string {
  if (withDemo) return `  demo sign-ins (password ${DEMO_PASSWORD}):\n${DEMO_USERS.map((u) => `    ${u.role.padEnd(15)} ${u.email}`).join('\n')}`;
  if (setup) return `  first admin:  open this one-time link to choose the password of ${setup.email}\n                ${setup.link}\n                (it works once, for 72 hours; the next start prints a new one until an admin has a password)`;
  return '  sign in with your admin account';
}

async function waitForHealth(healthUrl: string) {
  for (let i = 0; i < 300; i++) {
    if (childGone || stopping) return; // the exit handler or a signal is stopping everything
    try {
      const res = await fetch(healthUrl);
      await res.text();
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the server did not answer ${healthUrl} within 60 s`);
}
