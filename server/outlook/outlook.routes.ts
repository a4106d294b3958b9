import { idParams } from '../../shared/api/common.schema';
import { districtOutlookResponse, outlookQuery } from '../../shared/api/outlook.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { OutlookService } from './outlook.service';

/** The Case outlook of a district (docs/outlook.md); scoped as the District file. */
export function outlookRoutes(ctx: AppContext) {
  const service = new OutlookService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/districts/:id/outlook', access: 'signed-in', response: districtOutlookResponse, params: idParams, query: outlookQuery,
      handler: ({ principal, params, query }) => service.outlook(principal, params.id, query),
    }),
  ];
}
