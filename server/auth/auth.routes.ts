import type { NextFunction, Request, Response } from 'express';
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
import { preferencesOf } from '../users/user.presenter';
import { UsersRepository } from '../users/users.repository';
import type { AuthService } from './auth.service';
import { sessionCookieOptions } from './session.middleware';
import { passwordResetRequestedResponse } from '../../shared/api/auth.schema';

/**
 * Sign-in attempts are limited per address (every attempt counts) and per account (failed attempts
 * count: a user who signs in often is never locked out by their own successes). Past the limit the
 * answer is 429 `too_many_attempts` (params `what`, `retryAfterMinutes`) with Retry-After until the window ends, even with the right
 * password. express-rate-limit's memory store: per process; with several instances each counts its
 * own share (noted in DEVELOPERS.md). Password-reset requests are limited the same way, so nobody
 * floods a mailbox. Figures: docs/security.md.
 */
function attemptLimiters(ctx: AppContext, what: 'sign-in' | 'password-reset') {
  const windowMs = ctx.config.SIGN_IN_WINDOW_MINUTES * 60_000;
  const handler = (scope: 'address' | 'account') => (req: Request, res: Response, next: NextFunction) => {
    const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
    const seconds = Math.max(1, Math.ceil(((reset?.getTime() ?? Date.now() + windowMs) - Date.now()) / 1000));
    res.setHeader('Retry-After', String(seconds));
    ctx.logger.warn({ event: 'auth.locked-out', what, scope, retryAfterSeconds: seconds }, `too many ${what} attempts`);
    const minutes = Math.ceil(seconds / 60);
    // Messages are data: the client words `what` and `retryAfterMinutes` in the reader's language
    // (src/lib/error-text.ts); the message is only the English fallback for other clients.
    next(new HttpError(429, 'too_many_attempts', `Too many ${what} attempts; retry after ${minutes} min.`, undefined, { what, retryAfterMinutes: minutes }));
  };
  const emailOf = (req: Request) => (typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : null);
  return [
    rateLimit({ windowMs, limit: ctx.config.SIGN_IN_LIMIT_PER_ADDRESS, standardHeaders: 'draft-8', legacyHeaders: false, handler: handler('address') }),
    rateLimit({
      windowMs,
      limit: ctx.config.SIGN_IN_LIMIT_PER_ACCOUNT,
      standardHeaders: false,
      legacyHeaders: false,
      skip: (req) => emailOf(req) === null,
      // Sign-in: only failures count; a reset request always answers 202, so every request counts.
      skipSuccessfulRequests: what === 'sign-in',
      keyGenerator: (req) => `${what}:${emailOf(req)}`,
      handler: handler('account'),
    }),
  ];
}

export function authRoutes(ctx: AppContext, auth: AuthService) {
  const users = new UsersRepository(ctx.ds);
  return [
    defineRoute({
      method: 'post',
      path: '/auth/sign-in',
      access: 'public', response: meResponse,
      body: signInBody,
      before: attemptLimiters(ctx, 'sign-in'),
      handler: async ({ body }, req, res) => {
        const session = await auth.signIn(body);
        // A new token at every sign-in; the session the browser held before (if any) ends (ASVS V7.2.4).
        await auth.signOut(req.cookies?.[auth.cookieName], 'auth.session-replaced');
        res.cookie(auth.cookieName, session.token, sessionCookieOptions(ctx.config, session.expiresAt));
        const me = await users.findWithDistricts(session.userId);
        return presentMe(me!);
      },
    }),
    defineRoute({
      method: 'post',
      path: '/auth/sign-out',
      access: 'public', response: 'empty',
      handler: async (_input, req, res) => {
        await auth.signOut(req.cookies?.[auth.cookieName]);
        res.clearCookie(auth.cookieName, sessionCookieOptions(ctx.config));
        return undefined;
      },
    }),
    defineRoute({
      method: 'get',
      path: '/me',
      access: 'signed-in', response: meResponse,
      handler: async ({ principal }) => presentMe((await users.findWithDistricts(principal.userId))!),
    }),
    defineRoute({
      method: 'post',
      path: '/auth/password-reset',
      access: 'public', response: passwordResetRequestedResponse,
      body: passwordResetRequestBody,
      before: attemptLimiters(ctx, 'password-reset'),
      status: 202,
      handler: async ({ body }) => {
        await auth.requestPasswordReset(body.email);
        return { status: 'sent-if-known' };
      },
    }),
    defineRoute({
      method: 'post',
      path: '/auth/password-reset/confirm',
      access: 'public', response: 'empty',
      body: passwordResetConfirmBody,
      handler: async ({ body }) => auth.confirmPasswordReset(body.token, body.password),
    }),
    defineRoute({
      method: 'post',
      path: '/auth/invite/accept',
      access: 'public', response: 'empty',
      body: inviteAcceptBody,
      handler: async ({ body }) => auth.acceptInvite(body.token, body.password),
    }),
  ];
}

function presentMe({ user, districts, regions }: NonNullable<Awaited<ReturnType<UsersRepository['findWithDistricts']>>>) {
  return meResponse.parse({ id: user.id, email: user.email, displayName: user.displayName, role: user.role, districts, regions, preferences: preferencesOf(user) });
}
