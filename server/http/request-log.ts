import type { Request, RequestHandler } from 'express';
import type { Logger } from 'pino';
import type { Principal } from '../auth/principal';

/**
 * One structured line per API request, when the answer is sent: method, the route's pattern (never
 * the concrete path, which may hold a one-click unsubscribe token), status, duration, and the
 * signed-in user's id and role. Bodies, queries, cookies and e-mail addresses are never logged.
 * Refusals (401, 403, 429) are security events, logged at `info` with `event: 'access.denied'`;
 * everything else at `debug`, so the default level keeps the console quiet.
 */
export function requestLog(logger: Logger): RequestHandler {
  return (req, res, next) => {
    const started = process.hrtime.bigint();
    res.once('finish', () => {
      const principal = (req as Request & { principal?: Principal | null }).principal ?? null;
      const line = {
        method: req.method,
        route: routeOf(req),
        status: res.statusCode,
        ms: Math.round(Number(process.hrtime.bigint() - started) / 1e6),
        user: principal?.userId ?? null,
        role: principal?.role ?? null,
      };
      if (res.statusCode === 401 || res.statusCode === 403 || res.statusCode === 429)
        logger.info({ event: 'access.denied', ...line }, 'request refused');
      else logger.debug(line, 'request');
    });
    next();
  };
}

/** The matched route's pattern under /api (`/flags/:id`), or `(no route)` for an unknown path. */
export function routeOf(req: Request): string {
  return (req as Request & { route?: { path?: string } }).route?.path ?? '(no route)';
}
