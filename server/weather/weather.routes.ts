import type { AppContext } from '../app-context';
import type { RouteDef } from '../http/route';

/** Weather intake routes (stations, uploads, district series). */
export function weatherRoutes(_ctx: AppContext): RouteDef[] {
  return [];
}
