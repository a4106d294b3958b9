/**
 * `npm test` after scripts/test.sh has made sure of node modules, PostgreSQL and Chromium:
 * a throw-away test cluster (never the demo data; fsync off), migrations into a template database,
 * a mail catcher on test ports, the client build, the guard rails (type check, lint, layer rules; whole
 * runs only), then vitest with any arguments passed on
 * (`npm test -- tests/api/auth.test.ts`). Each test file gets its own copy of the template database.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';
import { buildClient } from './lib/build-client';
import { runGuardRails } from './lib/guard-rails';
import { ensureDatabase, startCluster, stopCluster } from './lib/cluster';
import { projectDir } from './lib/dev-database';
import { startMailCatcher } from './lib/mail-catcher';
import { ports } from './lib/ports';
import { migrate } from './lib/prepare-database';
import { loadLocalSecrets } from './lib/secrets';
import { startFakeFeed } from '../sample/fake-feed';

const t0 = Date.now();
const secrets = loadLocalSecrets(projectDir, 'test');
const cluster = await startCluster({ projectDir, name: 'test', port: ports.testPg, durable: false });
let exitCode = 1;
try {
  const templateUrl = await ensureDatabase(cluster, {
    name: 'broodcast_test', user: 'broodcast', password: secrets.databasePassword, fresh: true,
  });
  const admin = new pg.Client(cluster.adminConfig);
  await admin.connect();
  const stale = await admin.query("SELECT datname FROM pg_database WHERE datname LIKE 'broodcast_test\\_%'");
  for (const row of stale.rows) await admin.query(`DROP DATABASE IF EXISTS "${row.datname}" WITH (FORCE)`);
  await admin.end();
  await migrate(templateUrl);

  const maildev = await startMailCatcher(ports.testSmtp, ports.testMailWeb, path.join(projectDir, '.local', 'mail', 'test'), { fresh: true });
  const feedKey = `test-feed-${Date.now().toString(36)}`;
  const feed = await startFakeFeed({ port: ports.testFeed, key: feedKey });
  try {
    // The browser tests serve the built client; a run of named test files outside tests/browser skips the build.
    const files = process.argv.slice(2).filter((a) => a.startsWith('tests/'));
    if (files.length === 0 || files.some((f) => f.startsWith('tests/browser'))) await buildClient();
    else console.log('› no browser test named: the client build is skipped');
    // The whole suite (no file named, as CI runs it) first passes the type check, lint and layer rules.
    const railsOk = files.length === 0 ? await runGuardRails(templateUrl) : true;
    if (!railsOk) throw new Error('a guard rail failed (above); no test was run');
    console.log(`› test set-up took ${((Date.now() - t0) / 1000).toFixed(1)} s`);
    exitCode = await new Promise<number>((resolve) => {
      const child = spawn(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', ...process.argv.slice(2)], {
        cwd: projectDir,
        stdio: 'inherit',
        env: {
          ...process.env,
          NODE_ENV: 'test',
          TEST_TEMPLATE_DATABASE_URL: templateUrl,
          TEST_SMTP_PORT: String(ports.testSmtp),
          TEST_MAIL_WEB_PORT: String(ports.testMailWeb),
          TEST_FEED_URL: feed.url,
          TEST_FEED_KEY: feedKey,
        },
      });
      child.once('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    });
  } finally {
    await maildev.stop();
    await feed.stop();
  }
} catch (err) {
  console.error(err);
} finally {
  // Only a cluster this run started: one already running belongs to another command (a second npm test waits on the lock).
  if (cluster.startedHere) stopCluster(cluster);
}
console.log(`› npm test finished in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
process.exit(exitCode);
