import { rateLimit } from 'express-rate-limit';
import {
  inviteAcceptBody,
  meResponse,
  passwordResetConfirmBody,
  passwordResetRequestBody,
  signInBody,
} from '../../shared/api/auth.schema';
import type { AppContext } from '../app-context';
import { HttpError } from '../http/errors';
import { defineRoute } from '../http/route';
import { UsersRepository } from '../users/users.repository';
import type { AuthService } from './auth.service';
import { SESSION_COOKIE, sessionCookieOptions } from './session.middleware';

/**
 * Sign-in attempts are limited per address and per account (express-rate-limit's memory store:
 * per process; with several instances each counts its own share — noted in DEVELOPERS.md).
 */
function signInLimiters(ctx: AppContext) {
  const windowMs = ctx.config.SIGN_IN_WINDOW_MINUTES * 60_000;
  const tooMany = () => {
    throw new HttpError(429, 'too_many_attempts', 'Too many sign-in attempts. Wait a few minutes and try again.');
  };
  const handler = (_req: unknown, _res: unknown, next: (err?: unknown) => void) => {
    try {
      tooMany();
    } catch (err) {
      next(err);
    }
  };
  return [
    rateLimit({ windowMs, limit: ctx.config.SIGN_IN_LIMIT_PER_ADDRESS, standardHeaders: 'draft-8', legacyHeaders: false, handler }),
    rateLimit({
      windowMs,
      limit: ctx.config.SIGN_IN_LIMIT_PER_ACCOUNT,
      standardHeaders: false,
      legacyHeaders: false,
      keyGenerator: (req) => `account:${String(req.body?.email ?? '').trim().toLowerCase()}`,
      handler,
    }),
  ];
}

export function authRoutes(ctx: AppContext, auth: AuthService) {
  const users = new UsersRepository(ctx.ds);
  return [
    defineRoute({
      method: 'post',
      path: '/auth/sign-in',
      access: 'public',
      body: signInBody,
      before: signInLimiters(ctx),
      handler: async ({ body }, _req, res) => {
        const session = await auth.signIn(body);
        res.cookie(SESSION_COOKIE, session.token, sessionCookieOptions(ctx.config, session.expiresAt));
        const me = await users.findWithDistricts(session.userId);
        return presentMe(me!);
      },
    }),
    defineRoute({
      method: 'post',
      path: '/auth/sign-out',
      access: 'public',
      handler: async (_input, req, res) => {
        await auth.signOut(req.cookies?.[SESSION_COOKIE]);
        res.clearCookie(SESSION_COOKIE, sessionCookieOptions(ctx.config));
        return undefined;
      },
    }),
    defineRoute({
      method: 'get',
      path: '/me',
      access: 'signed-in',
      handler: async ({ principal }) => presentMe((await users.findWithDistricts(principal.userId))!),
    }),
    defineRoute({
      method: 'post',
      path: '/auth/password-reset',
      access: 'public',
      body: passwordResetRequestBody,
      status: 202,
      handler: async ({ body }) => {
        await auth.requestPasswordReset(body.email);
        return { status: 'sent-if-known' };
      },
    }),
    defineRoute({
      method: 'post',
      path: '/auth/password-reset/confirm',
      access: 'public',
      body: passwordResetConfirmBody,
      handler: async ({ body }) => auth.confirmPasswordReset(body.token, body.password),
    }),
    defineRoute({
      method: 'post',
      path: '/auth/invite/accept',
      access: 'public',
      body: inviteAcceptBody,
      handler: async ({ body }) => auth.acceptInvite(body.token, body.password),
    }),
  ];
}

function presentMe({ user, districts }: NonNullable<Awaited<ReturnType<UsersRepository['findWithDistricts']>>>) {
  return meResponse.parse({ id: user.id, email: user.email, displayName: user.displayName, role: user.role, districts });
}
