import { districtFileQuery } from '../../shared/api/board.schema';
import { idParams } from '../../shared/api/common.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { BoardService } from './board.service';
import { DistrictFileService } from './district-file.service';
import { districtFileResponse } from '../../shared/api/board.schema';

export function boardRoutes(ctx: AppContext) {
  const board = new BoardService(ctx);
  const files = new DistrictFileService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/board', access: 'signed-in', response: 'stream',
      handler: async ({ principal }, req, res) => {
        const body = await board.boardBody(principal, req.acceptsEncodings('gzip') === 'gzip');
        // Express answers 304 itself when If-None-Match matches this ETag.
        res.set({ ETag: body.etag, Vary: 'Accept-Encoding', 'Cache-Control': 'private, no-cache' });
        if (body.gzip) res.set('Content-Encoding', 'gzip');
        res.type('application/json').send(body.data);
      },
    }),
    defineRoute({
      method: 'get', path: '/districts/:id/file', access: 'signed-in', response: districtFileResponse, params: idParams, query: districtFileQuery,
      handler: ({ principal, params, query }) => files.file(principal, params.id, query.season),
    }),
  ];
}
