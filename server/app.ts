import 'reflect-metadata';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import expressStaticGzip from 'express-static-gzip';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { AppContext } from './app-context';
import { authRoutes } from './auth/auth.routes';
import { AuthService } from './auth/auth.service';
import { sessionMiddleware } from './auth/session.middleware';
import { districtsRoutes } from './districts/districts.routes';
import { setupRoutes } from './setup/setup.routes';
import { importsRoutes } from './districts/imports.routes';
import { healthRoutes } from './health/health.routes';
import { csrfGuard } from './http/csrf';
import { apiNotFound, errorMiddleware } from './http/error-middleware';
import { jsonBody } from './http/json-body';
import { LIMITS } from './http/limits';
import { requestLog } from './http/request-log';
import { defineRoute, mountRoutes, type RouteDef } from './http/route';
import { buildOpenApi, openApiResponse } from './http/openapi';
import { usersRoutes } from './users/users.routes';
import { casesRoutes } from './cases/cases.routes';
import { weatherRoutes } from './weather/weather.routes';
import { boardRoutes } from './board/board.routes';
import { seasonRoutes } from './season/season.routes';
import { lookBackRoutes } from './skill/look-back.routes';
import { outlookRoutes } from './outlook/outlook.routes';
import { flagsRoutes } from './flags/flags.routes';
import { bulletinsRoutes } from './bulletins/bulletins.routes';
import { profilesRoutes } from './profiles/profiles.routes';
import { fieldRoutes } from './field/field.routes';
import { fieldRecordsRoutes } from './field/field-records.routes';

export interface BroodcastApp extends Express {
  locals: Express['locals'] & { routes: RouteDef[] };
}

/** Build the Express app (no listening): main.ts starts it, tests load it in-process with supertest. */
export function createApp(ctx: AppContext): BroodcastApp {
  const app = express() as BroodcastApp;
  app.disable('x-powered-by');
  if (ctx.config.TRUST_PROXY) app.set('trust proxy', 1);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'"],
          'font-src': ["'self'"],
          'img-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'object-src': ["'none'"],
          'base-uri': ["'none'"],
          'form-action': ["'self'"],
          'frame-ancestors': ["'none'"],
          'upgrade-insecure-requests': ctx.config.COOKIE_SECURE ? [] : null,
        },
      },
    }),
  );

  // Answers built on the fly (API JSON, the CSV reports, index.html) are compressed for slow networks; an
  // answer that is already encoded (the board's cached gzip, the pre-compressed assets below) is left as is.
  app.use(compression());

  const auth = new AuthService(ctx);
  const routes: RouteDef[] = [
    ...healthRoutes(ctx),
    ...authRoutes(ctx, auth),
    ...usersRoutes(ctx),
    ...districtsRoutes(ctx),
    ...importsRoutes(ctx),
    ...setupRoutes(ctx),
    ...weatherRoutes(ctx),
    ...casesRoutes(ctx),
    ...seasonRoutes(ctx),
    ...boardRoutes(ctx),
    ...flagsRoutes(ctx),
    ...bulletinsRoutes(ctx),
    ...profilesRoutes(ctx),
    ...lookBackRoutes(ctx),
    ...outlookRoutes(ctx),
    ...fieldRoutes(ctx),
    ...fieldRecordsRoutes(ctx),
  ];
  // The OpenAPI document of this very table (server/http/openapi.ts), for admins.
  routes.push(defineRoute({ method: 'get', path: '/openapi.json', access: 'api.describe', response: openApiResponse, handler: () => buildOpenApi(routes) }));
  app.locals.routes = routes;

  const api = express.Router();
  // One log line per request (security refusals at info), then the cross-site guard for every
  // state-changing request, JSON or multipart, before any body is read (docs/security.md).
  api.use(requestLog(ctx.logger));
  api.use(csrfGuard({ appUrl: ctx.config.APP_URL, logger: ctx.logger }));
  // API answers hold health data: never kept in a browser or proxy cache (a route may set its own).
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // District boundaries can be large GeoJSON; every other body is read by its own route, under 1 MB
  // (server/http/route.ts), and every JSON body's nesting is bounded before it is parsed.
  api.use('/districts/:id/boundary', jsonBody(LIMITS.JSON_BOUNDARY_MAX_BYTES));
  api.use(cookieParser());
  api.use(sessionMiddleware(auth));
  mountRoutes(api, routes, { checkResponses: ctx.config.CHECK_RESPONSES ?? ctx.config.NODE_ENV === 'test', logger: ctx.logger });
  api.use(apiNotFound);
  api.use(errorMiddleware(ctx.logger));
  app.use('/api', api);

  // The built client (docs/offline.md, "Fast on a slow network"): the build writes a brotli (.br) and gzip
  // (.gz) copy of every script, style and font next to it, and the one the browser accepts is sent with its
  // Content-Encoding. Hashed files under assets/ never change: cached a year, immutable. index.html, the
  // service worker and the manifest are revalidated on every visit; other unhashed files (icons) for an hour.
  const dist = path.resolve(ctx.config.CLIENT_DIST);
  const index = path.join(dist, 'index.html');
  app.use(
    expressStaticGzip(dist, {
      enableBrotli: true,
      orderPreference: ['br', 'gz'],
      index: false,
      serveStatic: {
        index: false,
        maxAge: '1h',
        setHeaders: (res, file) => setClientCacheHeaders(res, path.relative(dist, file)),
      },
    }),
  );
  app.use((req, res, next) => {
    if (req.method !== 'GET' || !req.accepts('html')) return next();
    if (!existsSync(index)) return res.status(503).type('text').send('The client is not built yet: run npm start.');
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile('index.html', { root: dist, cacheControl: false });
  });
  return app;
}

/** Cache-Control of a file of the built client, by its path inside dist/client (with .br/.gz when compressed). */
export function setClientCacheHeaders(res: { setHeader(name: string, value: string): unknown }, relative: string): void {
  const file = relative.split(path.sep).join('/').replace(/\.(br|gz)$/, '');
  if (file.startsWith('assets/')) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
  // The shell and the service worker and manifest are checked for a new version on every visit (docs/offline.md).
  else if (/^(index\.html|sw\.js|manifest\.webmanifest)$/.test(file)) res.setHeader('Cache-Control', 'no-cache');
}
