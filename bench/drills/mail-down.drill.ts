/**
 * Fault drill: stop the mail server during a bulletin send. The drill loads the invented Halvern Region
 * into its own database (broodcast_drill_mail on the dev cluster), adds SUBSCRIBERS readers subscribed to
 * every district's bulletin, starts its own mail catcher (maildev on free loopback ports) and the real
 * server (outbox worker every second, short back-off), runs the season, and has the supervisor send the
 * bulletin. Once a share of the mail has arrived it stops the mail catcher, keeps it down, then starts a
 * new one on the same port. Every queued message must arrive (nothing lost), and no Message-ID twice
 * (nothing sent twice); the outbox must end with every message sent, none failed.
 * Run: tsx bench/drills/mail-down.drill.ts [--quick] [--subscribers N]
 * The last line of the output is one JSON object with the figures.
 */
import 'reflect-metadata';
import path from 'node:path';
import { startMailCatcher } from '../../scripts/lib/mail-catcher';
import { drillDatabase, freePort, isQuick, option, pool, printFigures, projectDir, serverEnv, signIn, sleep, startServer } from './drill-lib';

const QUICK = isQuick();
const SUBSCRIBERS = option('subscribers', QUICK ? 10 : 30);
const DOWN_SECONDS = option('down-seconds', QUICK ? 3 : 6);
const STOP_AT_SHARE = 0.3;

const { url, jwtSecret } = await drillDatabase('broodcast_drill_mail', { seedDemo: true });
const db = pool(url);
await db.query(
  `INSERT INTO users (email, display_name, role, password_hash)
   SELECT 'reader-' || i || '@drill.example', 'Drill reader ' || i, 'officer', NULL FROM generate_series(1, $1) i`, [SUBSCRIBERS]);
await db.query(
  `INSERT INTO subscriptions (user_id, district_id, kinds)
   SELECT u.id, d.id, ARRAY['bulletin'] FROM users u, districts d WHERE u.email LIKE 'reader-%@drill.example'`);

const smtp = await freePort();
const web = await freePort();
const mailDir = path.join(projectDir, '.local', 'mail', 'drill');
const received: { id: string; to: string }[] = [];
/** Every mail the catcher accepts, by Message-ID, as it arrives (maildev's SMTP server says so with 'new'). */
const listen = (m: Awaited<ReturnType<typeof startMailCatcher>>) =>
  (m.getServers()!.smtp as unknown as { on(e: 'new', f: (mail: Record<string, any>) => void): void }).on('new', (mail) => {
    if (process.env.DRILL_DEBUG && !received.length) console.log(Object.keys(mail), mail.headers);
    received.push({ id: mail.messageId ?? mail.headers?.['message-id'] ?? '?', to: mail.to?.[0]?.address ?? '?' });
  });
let maildev = await startMailCatcher(smtp, web, mailDir, { fresh: true });
listen(maildev);

const port = await freePort();
const server = await startServer(serverEnv(url, jwtSecret, port, {
  SMTP_PORT: String(smtp), OUTBOX_CRON: '* * * * * *', OUTBOX_BACKOFF_SECONDS: '1', OUTBOX_BACKOFF_MAX_SECONDS: '2', OUTBOX_MAX_ATTEMPTS: '50',
  SEASON_RUN_ON_START: 'true',
}));
const outbox = async () =>
  (await db.query(`SELECT count(*) FILTER (WHERE status = 'pending')::int AS pending, count(*) FILTER (WHERE status = 'sent')::int AS sent,
                          count(*) FILTER (WHERE status = 'failed')::int AS failed, count(*)::int AS total,
                          (SELECT count(*)::int FROM outbox_attempts WHERE outcome = 'retry') AS retries FROM outbox_messages`)).rows[0] as
    { pending: number; sent: number; failed: number; total: number; retries: number };

let figures: Record<string, unknown> = {};
try {
  // The start-up season run gives the Ladder its tiers; the bulletin needs them.
  for (let i = 0; i < 600; i++) {
    const [{ n }] = (await db.query(`SELECT count(*)::int AS n FROM season_runs WHERE status = 'running'`)).rows;
    const [{ t }] = (await db.query(`SELECT count(*)::int AS t FROM district_tiers`)).rows;
    if (n === 0 && t > 0) break;
    await sleep(200);
  }
  // Advisories and invitations the seed may have queued are delivered first; the drill counts the bulletin only.
  for (let i = 0; i < 300 && (await outbox()).pending > 0; i++) await sleep(200);
  const already = (await outbox()).total;
  const receivedBefore = received.length;

  const cookie = await signIn(server.base, 'supervisor@halvern.example', 'broodcast-demo');
  const t0 = performance.now();
  const res = await fetch(`${server.base}/api/bulletins/send`, { method: 'POST', headers: { cookie } });
  const sent = (await res.json()) as { bulletinsWritten: number; messagesQueued: number };
  if (res.status !== 200) throw new Error(`bulletin send answered ${res.status}: ${JSON.stringify(sent)}`);
  const queued = sent.messagesQueued;
  const got = () => received.length - receivedBefore;
  while (got() < Math.ceil(queued * STOP_AT_SHARE) && performance.now() - t0 < 120_000) await sleep(5);
  const secondsToStop = (performance.now() - t0) / 1000;
  await maildev.stop();
  const atStop = got();
  await sleep(DOWN_SECONDS * 1000);
  const whileDown = await outbox();
  const arrivedWhileDown = got() - atStop;
  maildev = await startMailCatcher(smtp, web, mailDir);
  listen(maildev);
  const t1 = performance.now();
  let state = await outbox();
  for (let i = 0; i < 1200 && (state.pending > 0 || got() < queued); i++) {
    await sleep(100);
    state = await outbox();
  }
  const secondsAfterReturn = (performance.now() - t1) / 1000;
  await sleep(1500); // anything sent twice would arrive now
  // A mail the catcher acknowledged just as it stopped may have been stored without its 'new' event: the
  // new catcher reads the mail folder back, so its list is checked too.
  const listed = (await (await fetch(`http://127.0.0.1:${web}/api/email`, { headers: { accept: 'application/json' } })).json()) as { messageId?: string; headers?: Record<string, string> }[];
  const onDisk = new Set(listed.map((m) => m.messageId ?? m.headers?.['message-id']).filter(Boolean));
  const mine = received.slice(receivedBefore);
  const seenIds = new Set(mine.map((m) => m.id));
  const ids = new Set([...seenIds, ...[...onDisk].filter((id) => id !== undefined) as string[]]);
  const [{ bulletinMessages }] = (await db.query(`SELECT count(*)::int AS "bulletinMessages" FROM outbox_messages WHERE kind = 'bulletin'`)).rows;
  if (process.env.DRILL_DEBUG) console.log('first listed mail keys:', Object.keys(listed[0] ?? {}));
  figures = {
    drill: 'mail-down', subscribers: SUBSCRIBERS, bulletins: sent.bulletinsWritten, queued, bulletinMessages, outboxBefore: already,
    arrivedBeforeStop: atStop, arrivedWhileDown, downSeconds: DOWN_SECONDS, retriesWhileDown: whileDown.retries,
    delivered: ids.size, lost: queued - ids.size, sentTwice: mine.length - seenIds.size, caughtList: listed.length,
    inListNotSeen: [...onDisk].filter((id) => !seenIds.has(id as string)).length, secondsToStop: +secondsToStop.toFixed(1), secondsAfterReturn: +secondsAfterReturn.toFixed(1),
    outbox: { pending: state.pending, sent: state.sent, failed: state.failed }, seconds: +((performance.now() - t0) / 1000).toFixed(1),
  };
  console.log(
    `mail server stopped during a bulletin send: ${sent.bulletinsWritten} bulletins, ${queued} messages queued; ${atStop} had arrived when it stopped, ` +
    `${arrivedWhileDown} while down (${DOWN_SECONDS} s, ${whileDown.retries} attempts deferred); after it returned: ${ids.size}/${queued} delivered, ` +
    `lost ${queued - ids.size}, sent twice ${mine.length - seenIds.size}; outbox pending ${state.pending}, failed ${state.failed}`,
  );
} finally {
  await server.kill('SIGTERM');
  await maildev.stop().catch(() => undefined);
  await db.end();
}
printFigures(figures);
process.exit(0);
