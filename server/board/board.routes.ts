import { districtFileQuery } from '../../shared/api/board.schema';
import { idParams } from '../../shared/api/common.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { BoardService } from './board.service';
import { DistrictFileService } from './district-file.service';

export function boardRoutes(ctx: AppContext) {
  const board = new BoardService(ctx);
  const files = new DistrictFileService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/board', access: 'signed-in',
      handler: async ({ principal }, _req, res) => {
        res.type('application/json').send(await board.boardJson(principal));
      },
    }),
    defineRoute({
      method: 'get', path: '/districts/:id/file', access: 'signed-in', params: idParams, query: districtFileQuery,
      handler: ({ principal, params, query }) => files.file(principal, params.id, query.season),
    }),
  ];
}
