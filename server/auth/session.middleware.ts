import type { CookieOptions, RequestHandler } from 'express';
import type { Config } from '../config';
import type { AuthService } from './auth.service';

export const SESSION_COOKIE = 'broodcast_session';

/**
 * With Secure cookies (COOKIE_SECURE=true, behind TLS) the name carries the `__Host-` prefix, so the
 * browser takes it only from this host, over HTTPS, for path / and without a Domain. Over plain HTTP
 * on the loopback (npm start, tests) the prefix is not allowed and the bare name is used.
 */
export const sessionCookieName = (config: Pick<Config, 'COOKIE_SECURE'>) =>
  config.COOKIE_SECURE ? `__Host-${SESSION_COOKIE}` : SESSION_COOKIE;

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
      const token = req.cookies?.[auth.cookieName];
      (req as any).principal = token ? await auth.principalFromToken(token) : null;
      next();
    } catch (err) {
      next(err);
    }
  };
}
