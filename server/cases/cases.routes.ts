import type { AppContext } from '../app-context';
import type { RouteDef } from '../http/route';

/** Case ledger and field survey routes. */
export function casesRoutes(_ctx: AppContext): RouteDef[] {
  return [];
}
