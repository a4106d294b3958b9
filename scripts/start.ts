/**
 * `npm start` after scripts/start.sh has made sure of node modules and PostgreSQL's binaries:
 * the dev cluster, migrations, the demo region, the mail catcher, the client build, the server.
 * Ctrl-C stops everything it started; the data stays in the cluster for the next start.
 */
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { stopCluster } from './lib/cluster';
import { buildClient } from './lib/build-client';
import { projectDir, startDevDatabase } from './lib/dev-database';
import { startMailCatcher } from './lib/mail-catcher';
import { migrate } from './lib/prepare-database';
import { ports } from './lib/ports';
import { DEMO_PASSWORD, DEMO_USERS } from '../sample/demo-region';
import { startFakeFeed } from '../sample/fake-feed';

const started = Date.now();
const { cluster, url, secrets } = await startDevDatabase();
const cleanups: (() => Promise<void> | void)[] = [() => stopCluster(cluster)];
let child: ReturnType<typeof spawn> | null = null;

async function stopAll(code: number) {
  if (child && child.exitCode === null) {
    child.kill('SIGTERM');
    await new Promise((r) => child!.once('exit', r));
  }
  for (const fn of cleanups.reverse()) await Promise.resolve(fn()).catch((e) => console.error(e));
  process.exit(code);
}
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

try {
  const { migrations, seeded } = await migrate(url, { seedDemo: { nodeEnv: 'development', bcryptCost: 12 } });
  if (migrations.length) console.log(`› ran ${migrations.length} migration(s)`);
  console.log(seeded ? '› loaded the invented Halvern Region (demo data)' : '› reusing the data already in the cluster');

  const maildev = await startMailCatcher(ports.smtp, ports.mailWeb, path.join(projectDir, '.local', 'mail', 'dev'));
  cleanups.push(() => maildev.stop());
  const feedKey = randomBytes(18).toString('base64url');
  const feed = await startFakeFeed({ port: ports.feed, key: feedKey });
  cleanups.push(() => feed.stop());

  console.log('› building the client');
  await buildClient();

  const appUrl = `http://127.0.0.1:${ports.app}`;
  child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: projectDir,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: {
      ...process.env,
      NODE_ENV: 'development',
      PORT: String(ports.app),
      DATABASE_URL: url,
      JWT_SECRET: process.env.JWT_SECRET ?? secrets.jwtSecret,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(ports.smtp),
      APP_URL: process.env.APP_URL ?? appUrl,
      WEATHER_FEED_URL: process.env.WEATHER_FEED_URL ?? feed.url,
      WEATHER_FEED_KEY: process.env.WEATHER_FEED_KEY ?? feedKey,
      WEATHER_FEED_CRON: process.env.WEATHER_FEED_CRON ?? '*/30 * * * *',
    },
  });
  child.once('exit', (code) => {
    console.error(`server exited (${code})`);
    void stopAll(code ?? 1);
  });
  await waitForHealth(`${appUrl}/api/health`);
  console.log(`
Broodcast is running (set-up took ${((Date.now() - started) / 1000).toFixed(1)} s)
  app:          ${appUrl}
  mail catcher: http://127.0.0.1:${ports.mailWeb}
  demo sign-ins (password ${DEMO_PASSWORD}):
${DEMO_USERS.map((u) => `    ${u.role.padEnd(15)} ${u.email}`).join('\n')}
Press Ctrl-C to stop; the data stays for the next start.
`);
} catch (err) {
  console.error(err);
  await stopAll(1);
}

async function waitForHealth(healthUrl: string) {
  for (let i = 0; i < 150; i++) {
    try {
      const res = await fetch(healthUrl);
      await res.text();
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the server did not answer ${healthUrl}`);
}
