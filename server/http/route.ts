import type { NextFunction, Request, Response, Router } from 'express';
import type { ZodType } from 'zod';
import type { Logger } from 'pino';
import { rolesWith, type Ability } from '../../shared/permissions';
import type { Role } from '../../shared/roles';
import type { Principal } from '../auth/principal';
import { forbidden, unauthorized } from './errors';
import { jsonBody } from './json-body';
import { parseInput } from './validate';

/**
 * Who may call a route: anybody, any signed-in user, or the roles with an ability of the permission table
 * (shared/permissions.ts). Every route declares it. A list of roles is still accepted so that a branch
 * written before the table compiles, but tests/api/permission-table.test.ts fails on it: name an ability.
 */
export type Access = 'public' | 'signed-in' | Ability | readonly Role[];

/** The roles an access admits; null for 'public' and 'signed-in'. */
export function accessRoles(access: Access): readonly Role[] | null {
  if (access === 'public' || access === 'signed-in') return null;
  return typeof access === 'string' ? rolesWith(access) : access;
}

export interface RouteInput<B, Q, P> {
  body: B;
  query: Q;
  params: P;
  /** The signed-in user; null only on public routes. */
  principal: Principal;
}

export interface RouteDef<B = any, Q = any, P = any> {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** Path under /api, in Express syntax. */
  path: string;
  access: Access;
  body?: ZodType<B>;
  query?: ZodType<Q>;
  params?: ZodType<P>;
  /**
   * The contract of a successful answer: a zod schema from shared/api/*.schema.ts (the one the client
   * checks the answer with), 'empty' for a route that only answers 204, or 'stream' for one that writes
   * its own non-JSON answer (CSV, PDF, HTML, a cached gzip). In tests every JSON answer is checked
   * against it (mountRoutes' checkResponses).
   */
  response?: ZodType | 'empty' | 'stream';
  /** Status of a successful answer (default 200; a handler returning undefined answers 204). */
  status?: number;
  /** Middleware that must run before validation (for example multer for uploads). */
  before?: ((req: Request, res: Response, next: NextFunction) => void)[];
  handler: (input: RouteInput<B, Q, P>, req: Request, res: Response) => Promise<unknown> | unknown;
}

export const defineRoute = <B, Q, P>(def: RouteDef<B, Q, P>) => def as RouteDef;

function checkAccess(access: Access, principal: Principal | null): void {
  if (access === 'public') return;
  if (!principal) throw unauthorized();
  const roles = accessRoles(access);
  if (roles && !roles.includes(principal.role)) throw forbidden();
}

export interface MountOptions {
  /**
   * Check every successful JSON answer against the route's `response` schema; a mismatch is logged with
   * the zod issues and answered 500 `response_contract_violation` (on in tests: config CHECK_RESPONSES).
   */
  checkResponses?: boolean;
  logger?: Logger;
}

/** Wraps res.json so that a successful answer that breaks the route's contract becomes a 500 (tests only). */
function checkAnswers(route: RouteDef, res: Response, logger: Logger | undefined): void {
  const send = res.json.bind(res);
  res.json = (body: unknown) => {
    if (res.statusCode >= 300) return send(body);
    const contract = route.response;
    let issues: unknown = null;
    // A route without a contract is listed by tests/api/response-contracts.test.ts instead.
    if (contract === undefined) return send(body);
    if (contract === 'empty') issues = 'the route declares an empty answer';
    else if (contract !== 'stream') {
      // What the client receives: the JSON text parsed back (dates as strings, undefined fields gone).
      const parsed = contract.safeParse(JSON.parse(JSON.stringify(body) ?? 'null'));
      if (!parsed.success) issues = parsed.error.issues.slice(0, 10);
    }
    if (issues === null) return send(body);
    logger?.error({ route: `${route.method.toUpperCase()} ${route.path}`, issues }, 'response_contract_violation');
    return res.status(500).type('json').send(
      JSON.stringify({
        error: {
          code: 'response_contract_violation',
          message: `The answer of ${route.method.toUpperCase()} ${route.path} does not match its contract.`,
          params: { issues: JSON.stringify(issues).slice(0, 2000) },
        },
      }),
    );
  };
}

/** Mount route definitions on a router; the caller keeps the list as the app's route table. */
export function mountRoutes(router: Router, routes: RouteDef[], options: MountOptions = {}): void {
  // Only a route that declares a body reads one, and only once its access is checked: a body sent to
  // any other route is never parsed (docs/security.md § Limits).
  const json = jsonBody();
  for (const route of routes) {
    const run = async (req: Request, res: Response) => {
      if (options.checkResponses) checkAnswers(route, res, options.logger);
      const principal = (req as Request & { principal?: Principal | null }).principal ?? null;
      checkAccess(route.access, principal);
      const input = {
        body: parseInput(route.body, req.body, 'body'),
        query: parseInput(route.query, req.query, 'query'),
        params: parseInput(route.params, req.params, 'params'),
        principal: principal as Principal,
      };
      const result = await route.handler(input, req, res);
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else res.status(route.status ?? 200).json(result);
    };
    // Access is checked before any upload middleware reads the request.
    const guard = (req: Request, _res: Response, next: NextFunction) => {
      try {
        checkAccess(route.access, (req as Request & { principal?: Principal | null }).principal ?? null);
        next();
      } catch (err) {
        next(err);
      }
    };
    router[route.method](route.path, guard, ...(route.body ? [json] : []), ...(route.before ?? []), run);
  }
}
