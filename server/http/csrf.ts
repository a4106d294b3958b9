import type { RequestHandler } from 'express';
import type { Logger } from 'pino';
import { HttpError } from './errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request forgery guard for every state-changing API request (POST, PUT, PATCH, DELETE),
 * JSON and multipart alike. It is the second layer behind the SameSite=Strict session cookie:
 *  - `Sec-Fetch-Site` (sent by every current browser) must be `same-origin` (or `none`: typed by the user);
 *  - `Origin`, when present, must be the app's own origin (APP_URL) or the origin the request was sent to;
 *    `Origin: null` (sandboxed frames, some redirects) is refused.
 * A request with neither header does not come from a browser page (curl, supertest, a mail program's
 * one-click unsubscribe) and carries no ambient cookie of a victim, so it passes.
 * A refusal is a 403 `csrf_rejected`, logged as a security event.
 */
export function csrfGuard(opts: { appUrl: string; logger?: Logger }): RequestHandler {
  const appOrigin = new URL(opts.appUrl).origin;
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const site = req.get('sec-fetch-site');
    const origin = req.get('origin');
    let reason: string | null = null;
    if (site !== undefined && site !== 'same-origin' && site !== 'none') reason = `sec-fetch-site ${site}`;
    else if (origin !== undefined) {
      const own = `${req.protocol}://${req.get('host')}`;
      if (origin === 'null') reason = 'origin null';
      else if (origin !== appOrigin && origin !== own) reason = 'foreign origin';
    }
    if (!reason) return next();
    opts.logger?.warn({ event: 'csrf.rejected', method: req.method, route: req.path, reason, origin: origin ?? null }, 'cross-site request refused');
    next(new HttpError(403, 'csrf_rejected', 'This request came from another site and was refused.'));
  };
}
