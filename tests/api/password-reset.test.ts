import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { passwordResetMail } from '../../server/auth/auth.mails';
import { createMailer, type Mailer } from '../../server/mail/mailer';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { makeUser, signedInAgent } from '../support/factories';
import { linkToken, waitForMail } from '../support/mail';
import { createTestApp, testConfig, type TestApp } from '../support/test-app';

/**
 * Password reset without account enumeration (issue 14, item 10): the same answer and the same work for
 * a known and an unknown address, the mail through the outbox (so a mail server that is down loses
 * nothing), and display names that cannot add lines to a mail.
 */
let t: TestApp;
let live: Mailer;

beforeAll(async () => {
  // The app's own mailer points at a closed port: the mail server is "down" whenever the app would send.
  t = await createTestApp({ SMTP_PORT: '9', SIGN_IN_LIMIT_PER_ADDRESS: '100000', SIGN_IN_LIMIT_PER_ACCOUNT: '100000' });
  live = createMailer(testConfig());
});
afterAll(async () => {
  live.close();
  await t.close();
});

const outboxRows = async () => (await t.ds.query('SELECT count(*)::int AS n FROM outbox_messages'))[0].n as number;
const tokenRows = async () => (await t.ds.query('SELECT count(*)::int AS n FROM one_time_tokens'))[0].n as number;

/** The SQL statements the app runs during `work`, with their values left out (TypeORM logs every query). */
async function statementsDuring(work: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  const spy = vi.spyOn(t.ds.logger, 'logQuery').mockImplementation((query: string) => {
    seen.push(query.replace(/\s+/g, ' ').trim());
  });
  try {
    await work();
  } finally {
    spy.mockRestore();
  }
  return seen;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

describe('password reset', () => {
  it('when a reset is asked for a known and for an unknown address, then the answers are identical and both do the same work (the same statements; one outbox row only for the account)', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    const unknown = `nobody-${Date.now()}@test.example`;
    const ask = (email: string) => request(t.app).post('/api/auth/password-reset').send({ email });

    const outbox0 = await outboxRows();
    const tokens0 = await tokenRows();
    let known!: request.Response;
    const knownSql = await statementsDuring(async () => (known = await ask(user.email)));
    expect(await outboxRows()).toBe(outbox0 + 1);
    expect(await tokenRows()).toBe(tokens0 + 1);
    let other!: request.Response;
    const unknownSql = await statementsDuring(async () => (other = await ask(unknown)));
    expect(await outboxRows()).toBe(outbox0 + 1); // the same INSERTs ran and selected no row
    expect(await tokenRows()).toBe(tokens0 + 1);

    expect(other.status).toBe(known.status);
    expect(other.status).toBe(202);
    expect(other.body).toEqual(known.body);
    expect(other.headers['content-length']).toBe(known.headers['content-length']);
    expect(unknownSql).toEqual(knownSql);
    expect(knownSql.filter((q) => /INSERT INTO outbox_messages/.test(q))).toHaveLength(1);
    const [row] = await t.ds.query(`SELECT kind, status, to_address FROM outbox_messages WHERE user_id = $1`, [user.id]);
    expect(row).toEqual({ kind: 'password-reset', status: 'pending', to_address: user.email });

    // Measured, not asserted (it depends on the machine): the median time of each answer.
    const times = { known: [] as number[], unknown: [] as number[] };
    for (let i = 0; i < 15; i++)
      for (const [k, email] of [['known', user.email], ['unknown', unknown]] as const) {
        const t0 = performance.now();
        await ask(email);
        times[k].push(performance.now() - t0);
      }
    console.log(`password reset median: known ${median(times.known).toFixed(1)} ms, unknown ${median(times.unknown).toFixed(1)} ms (15 each)`);
  });

  it('when the mail server is down at the time of the request, then the reset mail is kept in the outbox and arrives once the server is back', async () => {
    const user = await makeUser(t.ds, { role: 'epidemiologist' });
    const ask = await request(t.app).post('/api/auth/password-reset').send({ email: user.email });
    expect(ask.status).toBe(202);
    // The request sent nothing itself; the worker's first try meets the closed port and keeps the mail.
    const down = await new OutboxWorker(t.ctx).drain();
    expect(down).toMatchObject({ sent: 0, failed: 0 });
    const [pending] = await t.ds.query(`SELECT status, attempts FROM outbox_messages WHERE user_id = $1 AND kind = 'password-reset'`, [user.id]);
    expect(pending).toEqual({ status: 'pending', attempts: 1 });

    await t.ds.query(`UPDATE outbox_messages SET next_attempt_at = now() WHERE status = 'pending'`);
    await new OutboxWorker(t.ctx, { mailer: live }).drain();
    const mail = await waitForMail(user.email);
    expect(mail.subject).toBe('Broodcast: set a new password');
    const token = linkToken(mail)!;
    const confirm = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'a-brand-new-secret' });
    expect(confirm.status).toBe(204);
    await signedInAgent(t.app, user.email, 'a-brand-new-secret');
  });
});

describe('display names in mail', () => {
  it('when an admin gives a display name with a line break, then it is refused naming displayName and nothing is written', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const before = await t.ds.query('SELECT count(*)::int AS n FROM users');
    const invite = await admin.post('/api/users').send({ email: `crlf-${Date.now()}@test.example`, displayName: 'Eve\r\nBcc: mallory@evil.example', role: 'officer' });
    expect(invite.status).toBe(400);
    expect(invite.body.error.fields.map((f: { path: string }) => f.path)).toContain('displayName');
    const someone = await makeUser(t.ds, { role: 'officer' });
    const rename = await admin.patch(`/api/users/${someone.id}`).send({ displayName: 'Eve\nBcc: mallory@evil.example' });
    expect(rename.status).toBe(400);
    expect(rename.body.error.fields.map((f: { path: string }) => f.path)).toContain('displayName');
    expect(await t.ds.query('SELECT count(*)::int AS n FROM users')).toEqual([{ n: before[0].n + 1 }]); // "someone" only
  });

  it('when a name stored before the check holds CR/LF, then the mail shows it on one line (no fake "Bcc:" line)', () => {
    const mail = passwordResetMail('Eve\r\nBcc: mallory@evil.example', 'http://x.example/reset?token=abc', 1, 'en');
    expect(mail.text.split('\n').some((l) => /^Bcc:/i.test(l.trim()))).toBe(false);
    expect(mail.text).toContain('Eve Bcc: mallory@evil.example');
  });
});
