import 'reflect-metadata';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { AppContext } from './app-context';
import { authRoutes } from './auth/auth.routes';
import { AuthService } from './auth/auth.service';
import { sessionMiddleware } from './auth/session.middleware';
import { districtsRoutes } from './districts/districts.routes';
import { healthRoutes } from './health/health.routes';
import { csrfGuard } from './http/csrf';
import { apiNotFound, errorMiddleware } from './http/error-middleware';
import { requestLog } from './http/request-log';
import { mountRoutes, type RouteDef } from './http/route';
import { usersRoutes } from './users/users.routes';
import { casesRoutes } from './cases/cases.routes';
import { weatherRoutes } from './weather/weather.routes';
import { boardRoutes } from './board/board.routes';
import { seasonRoutes } from './season/season.routes';
import { flagsRoutes } from './flags/flags.routes';
import { bulletinsRoutes } from './bulletins/bulletins.routes';
import { profilesRoutes } from './profiles/profiles.routes';

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

  const auth = new AuthService(ctx);
  const routes: RouteDef[] = [
    ...healthRoutes(ctx),
    ...authRoutes(ctx, auth),
    ...usersRoutes(ctx),
    ...districtsRoutes(ctx),
    ...weatherRoutes(ctx),
    ...casesRoutes(ctx),
    ...seasonRoutes(ctx),
    ...boardRoutes(ctx),
    ...flagsRoutes(ctx),
    ...bulletinsRoutes(ctx),
    ...profilesRoutes(ctx),
  ];
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
  // District boundaries can be large GeoJSON; every other body stays under 1 MB.
  api.use('/districts/:id/boundary', express.json({ limit: '10mb', strict: true }));
  api.use(express.json({ limit: '1mb', strict: true }));
  api.use(cookieParser());
  api.use(sessionMiddleware(auth));
  mountRoutes(api, routes);
  api.use(apiNotFound);
  api.use(errorMiddleware(ctx.logger));
  app.use('/api', api);

  // The built client, with the single-page fallback for its routes.
  const dist = path.resolve(ctx.config.CLIENT_DIST);
  const index = path.join(dist, 'index.html');
  app.use(
    express.static(dist, {
      index: false,
      maxAge: '1h',
      // The service worker and the manifest are checked for a new version on every visit (docs/offline.md).
      setHeaders: (res, file) => {
        if (/[\\/](sw\.js|manifest\.webmanifest)$/.test(file)) res.setHeader('Cache-Control', 'no-cache');
      },
    }),
  );
  app.use((req, res, next) => {
    if (req.method !== 'GET' || !req.accepts('html')) return next();
    if (!existsSync(index)) return res.status(503).type('text').send('The client is not built yet: run npm start.');
    res.sendFile(index);
  });
  return app;
}
