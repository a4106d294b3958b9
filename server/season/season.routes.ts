import { z } from 'zod';
import { startSeasonRunBody } from '../../shared/api/board.schema';
import { idParams } from '../../shared/api/common.schema';
import { tierSettingsSchema } from '../../shared/tier';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { presentSeasonRun } from './season-run.presenter';
import { SeasonRunService } from './season-run.service';
import { TierSettingsService } from './tier-settings.service';

const tierSettingsBody = z.strictObject({
  settings: tierSettingsSchema,
  reason: z.string().trim().min(3, { message: 'must say why (3 characters or more)' }).max(500),
});

export function seasonRoutes(ctx: AppContext) {
  const runs = new SeasonRunService(ctx);
  const settings = new TierSettingsService(ctx.ds);
  return [
    defineRoute({
      method: 'get', path: '/season-runs', access: ['admin', 'officer'],
      handler: async () => ({ runs: (await runs.list()).map(presentSeasonRun) }),
    }),
    defineRoute({
      method: 'post', path: '/season-runs', access: ['admin', 'officer'], body: startSeasonRunBody, status: 202,
      handler: async ({ body, principal }) => presentSeasonRun(await runs.start({ kind: 'manual', full: body.full, requestedBy: principal.userId })),
    }),
    defineRoute({
      method: 'get', path: '/season-runs/:id', access: ['admin', 'officer'], params: idParams,
      handler: async ({ params }) => presentSeasonRun(await runs.get(params.id)),
    }),
    defineRoute({
      method: 'get', path: '/tier-settings', access: 'signed-in',
      handler: async () => ({ ...(await settings.current()), history: await settings.history() }),
    }),
    defineRoute({
      method: 'put', path: '/tier-settings', access: ['admin'], body: tierSettingsBody,
      handler: async ({ body, principal }) => settings.update(principal, body.settings, body.reason),
    }),
  ];
}
