import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { HealthRepository } from './health.repository';
import { healthResponse } from '../../shared/api/common.schema';

export function healthRoutes(ctx: AppContext) {
  return [
    defineRoute({
      method: 'get',
      path: '/health',
      access: 'public', response: healthResponse,
      handler: async (_input, _req, res) => {
        try {
          await new HealthRepository(ctx.ds.manager).ping();
          return { status: 'ok', database: 'up' };
        } catch {
          res.status(503).json({ status: 'degraded', database: 'down' });
          return;
        }
      },
    }),
  ];
}
