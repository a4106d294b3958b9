import type { DemoRemovedResponse, DemoSummaryResponse } from '../../shared/api/demo.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { conflict } from '../http/errors';
import { DEMO_USERS } from '../../sample/demo-region';
import { SetupRepository } from './setup.repository';

const DEMO_EMAILS = DEMO_USERS.map((u) => u.email);

/**
 * Removing the invented demo region from a running installation (issue 17): its districts (with everything
 * hanging from them: boundaries, populations, series, counts, surveys, tiers, flags, bulletins, subscriptions —
 * the foreign keys cascade) and its stations (with their weather) are deleted; its people are deactivated and
 * their sessions ended rather than deleted, so the audit trail keeps naming who did what. The admin who
 * removes it is never deactivated, even when it is the demo's own admin account. One transaction, audited.
 */
export class DemoRemovalService {
  constructor(private readonly ctx: AppContext) {}

  async summary(): Promise<DemoSummaryResponse> {
    return new SetupRepository(this.ctx.ds.manager).demoCounts(DEMO_EMAILS);
  }

  async remove(p: Principal, reason: string): Promise<DemoRemovedResponse> {
    return this.ctx.ds.transaction(async (manager) => {
      const setup = new SetupRepository(manager);
      // Other writers (an intake, a season run) wait for this, and a second removal finds nothing left.
      await setup.lockDistrictsAndStations();
      const districts = await setup.demoDistricts();
      const stations = await setup.demoStations();
      if (districts.length === 0 && stations.length === 0)
        throw conflict('no_demo_data', 'There is no demo data left to remove.');
      // Most rows hang from a district or station by a cascading foreign key; some stored results (tiers, for
      // one) are keyed by district_id / station_id without one, so every base table with such a column is
      // cleared of the demo's ids first — nothing of the demo is left behind as an orphan.
      await setup.deleteKeyed('station_id', stations.map((x) => x.id));
      await setup.deleteKeyed('district_id', districts.map((x) => x.id));
      await setup.deleteDemoStationsAndDistricts();
      const users = await setup.deactivateDemoUsers(DEMO_EMAILS, p.userId);
      await recordAudit(manager, {
        actorId: p.userId, action: 'demo.removed', entity: 'installation', entityId: 'demo',
        before: { districts: districts.map((d) => d.code), stations: stations.map((s) => s.code) },
        after: { usersDeactivated: users },
        reason,
      });
      return { districts: districts.length, stations: stations.length, usersDeactivated: users.length };
    });
  }
}
