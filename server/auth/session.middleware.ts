import type { CookieOptions, RequestHandler } from 'express';
import type { Config } from '../config';
import type { AuthService } from './auth.service';

export const SESSION_COOKIE = 'broodcast_session';

export const sessionCookieOptions = (config: Config, expiresAt?: Date): CookieOptions => ({
  httpOnly: true,
  sameSite: 'strict',
  secure: config.COOKIE_SECURE,
  path: '/',
  ...(expiresAt ? { expires: expiresAt } : {}),
});

/** Attach the principal of a live session (or null) to every request. */
export function sessionMiddleware(auth: AuthService): RequestHandler {
  return async (req, _res, next) => {
    try {
      const token = req.cookies?.[SESSION_COOKIE];
      (req as any).principal = token ? await auth.principalFromToken(token) : null;
      next();
    } catch (err) {
      next(err);
    }
  };
}
