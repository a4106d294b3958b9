import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { firstAdminLink } from '../../server/setup/first-admin';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows } from '../support/factories';

// Issue 17 item 4: an installation started without the demo prints a one-time link to create the first admin.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
}, 120_000);
afterAll(() => t.close());

const tokenOf = (link: string) => new URL(link).searchParams.get('token')!;

describe('the first admin of an empty installation', () => {
  it('when there is no admin, then a one-time invite link is made; a newer link replaces it; accepting it lets the admin sign in; then no link is made again', async () => {
    expect((await countRows(t.ds, 'users')).users).toBe(0);
    const first = (await firstAdminLink(t.ds, { appUrl: 'http://127.0.0.1:5999', email: 'Chief@Health.example' }))!;
    expect(first.email).toBe('chief@health.example');
    expect(first.link).toMatch(/^http:\/\/127\.0\.0\.1:5999\/invite\/accept\?token=[\w-]{40,}&lang=en$/);
    const [user] = await t.ds.query(`SELECT role, active, password_hash FROM users WHERE email = 'chief@health.example'`);
    expect(user).toMatchObject({ role: 'admin', active: true, password_hash: null });
    const [audit] = await t.ds.query(`SELECT action, reason FROM audit_events WHERE action = 'user.invited'`);
    expect(audit.reason).toContain('first admin');

    // A second start before the link was used: a new link, the old one no longer works, still one account.
    const second = (await firstAdminLink(t.ds, { appUrl: 'http://127.0.0.1:5999', email: 'chief@health.example' }))!;
    expect(tokenOf(second.link)).not.toBe(tokenOf(first.link));
    expect((await countRows(t.ds, 'users')).users).toBe(1);
    const old = await request(t.app).post('/api/auth/invite/accept').send({ token: tokenOf(first.link), password: 'a-long-first-password-17' });
    expect(old.status).toBe(400);
    expect(old.body.error.code).toBe('token_invalid');

    const accepted = await request(t.app).post('/api/auth/invite/accept').send({ token: tokenOf(second.link), password: 'a-long-first-password-17' });
    expect(accepted.status).toBeLessThan(300);
    const signIn = await request(t.app).post('/api/auth/sign-in').send({ email: 'chief@health.example', password: 'a-long-first-password-17' });
    expect(signIn.status).toBe(200);
    expect(signIn.body.role ?? signIn.body.user?.role).toBe('admin');
    // Once, only: the link is used, and with an admin who has a password none is made again.
    const again = await request(t.app).post('/api/auth/invite/accept').send({ token: tokenOf(second.link), password: 'another-long-password-17' });
    expect(again.status).toBe(400);
    expect(await firstAdminLink(t.ds, { appUrl: 'http://127.0.0.1:5999' })).toBeNull();
  });

  it('when the admin e-mail is not an address, then the start stops with a clear message and writes nothing', async () => {
    const before = await countRows(t.ds, 'users', 'one_time_tokens');
    await expect(firstAdminLink(t.ds, { appUrl: 'http://x.example', email: 'not an address' })).rejects.toThrow(/BROODCAST_ADMIN_EMAIL/);
    expect(await countRows(t.ds, 'users', 'one_time_tokens')).toEqual(before);
  });
});
