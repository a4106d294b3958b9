import { lookBackRunParams, lookBackScoresQuery, startLookBackBody } from '../../shared/api/look-back.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { presentLookBackRun } from './look-back.presenter';
import { LookBackService } from './look-back.service';
import { lookBackRunDto, lookBackRunsResponse, lookBackScoresResponse } from '../../shared/api/look-back.schema';

/** The Look-back: replayed past seasons and their scores (docs/skill.md). */
export function lookBackRoutes(ctx: AppContext) {
  const service = new LookBackService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/look-back/runs', access: 'lookBack.read', response: lookBackRunsResponse,
      handler: async () => ({ runs: (await service.list()).map(presentLookBackRun) }),
    }),
    defineRoute({
      method: 'post', path: '/look-back/runs', access: 'lookBack.start', response: lookBackRunDto, body: startLookBackBody, status: 202,
      handler: async ({ body, principal }) => presentLookBackRun(await service.start({ ...body, requestedBy: principal.userId })),
    }),
    defineRoute({
      method: 'get', path: '/look-back/runs/:id', access: 'lookBack.read', response: lookBackRunDto, params: lookBackRunParams,
      handler: async ({ params }) => presentLookBackRun(await service.get(params.id)),
    }),
    defineRoute({
      method: 'get', path: '/look-back/runs/:id/scores', access: 'lookBack.read', response: lookBackScoresResponse, params: lookBackRunParams, query: lookBackScoresQuery,
      handler: async ({ params, query }) => service.scores(params.id, query),
    }),
  ];
}
