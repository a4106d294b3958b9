import { demoRemoveBody } from '../../shared/api/demo.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { DemoRemovalService } from './demo-removal.service';
import { demoRemovedResponse, demoSummaryResponse } from '../../shared/api/demo.schema';

/** Setting up a real installation: what of the demo is left, and removing it (issue 17). */
export function setupRoutes(ctx: AppContext) {
  const demo = new DemoRemovalService(ctx);
  return [
    defineRoute({ method: 'get', path: '/demo', access: 'demo.manage', response: demoSummaryResponse, handler: () => demo.summary() }),
    defineRoute({
      method: 'post', path: '/demo/remove', access: 'demo.manage', response: demoRemovedResponse, body: demoRemoveBody,
      handler: ({ principal, body }) => demo.remove(principal, body.reason),
    }),
  ];
}
