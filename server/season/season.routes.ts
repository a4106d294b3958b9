import { startSeasonRunBody } from '../../shared/api/board.schema';
import { idParams } from '../../shared/api/common.schema';
import { tierSettingsBody, tierSettingsPreviewBody } from '../../shared/api/tier-settings.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { presentSeasonRun } from './season-run.presenter';
import { SeasonRunService } from './season-run.service';
import { TierSettingsService } from './tier-settings.service';
import { tierSettingsPreviewResponse, tierSettingsResponse, tierSettingsSaveResponse } from '../../shared/api/tier-settings.schema';
import { seasonRunDto, seasonRunsResponse } from '../../shared/api/board.schema';

export function seasonRoutes(ctx: AppContext) {
  const runs = new SeasonRunService(ctx);
  const settings = new TierSettingsService(ctx.ds);
  return [
    defineRoute({
      method: 'get', path: '/season-runs', access: 'seasonRuns.start', response: seasonRunsResponse,
      handler: async () => ({ runs: (await runs.list()).map(presentSeasonRun) }),
    }),
    defineRoute({
      method: 'post', path: '/season-runs', access: 'seasonRuns.start', response: seasonRunDto, body: startSeasonRunBody, status: 202,
      handler: async ({ body, principal }) => presentSeasonRun(await runs.start({ kind: 'manual', full: body.full, requestedBy: principal.userId })),
    }),
    defineRoute({
      method: 'get', path: '/season-runs/:id', access: 'seasonRuns.start', response: seasonRunDto, params: idParams,
      handler: async ({ params }) => presentSeasonRun(await runs.get(params.id)),
    }),
    defineRoute({
      method: 'get', path: '/tier-settings', access: 'signed-in', response: tierSettingsResponse,
      handler: async () => ({ ...(await settings.current()), history: await settings.history() }),
    }),
    defineRoute({
      method: 'put', path: '/tier-settings', access: 'tierSettings.manage', response: tierSettingsSaveResponse, body: tierSettingsBody,
      handler: async ({ body, principal }) => settings.update(principal, body.settings, body.reason),
    }),
    defineRoute({
      // The dry run before saving: how this week's Ladder would change. Writes nothing.
      method: 'post', path: '/tier-settings/preview', access: 'tierSettings.manage', response: tierSettingsPreviewResponse, body: tierSettingsPreviewBody,
      handler: async ({ body }) => settings.preview(body.settings),
    }),
  ];
}
