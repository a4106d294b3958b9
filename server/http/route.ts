import type { NextFunction, Request, Response, Router } from 'express';
import type { ZodType } from 'zod';
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

/** Mount route definitions on a router; the caller keeps the list as the app's route table. */
export function mountRoutes(router: Router, routes: RouteDef[]): void {
  // Only a route that declares a body reads one, and only once its access is checked: a body sent to
  // any other route is never parsed (docs/security.md § Limits).
  const json = jsonBody();
  for (const route of routes) {
    const run = async (req: Request, res: Response) => {
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
