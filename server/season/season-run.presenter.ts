import type { SeasonRunDto } from '../../shared/api/board.schema';
import type { SeasonRunEntity } from './season-run.entity';
import { failedCount } from './season-run.service';

export const presentSeasonRun = (r: SeasonRunEntity): SeasonRunDto => ({
  id: r.id,
  kind: r.kind,
  byPerson: r.requestedBy !== null,
  full: r.full,
  status: r.status,
  startedAt: new Date(r.startedAt).toISOString(),
  finishedAt: r.finishedAt ? new Date(r.finishedAt).toISOString() : null,
  asOf: r.asOf,
  districtsTotal: r.districtsTotal,
  districtsDone: r.districtsDone,
  districtsSkipped: r.districtsSkipped,
  rowsWritten: r.rowsWritten,
  districtsFailed: failedCount(r.warnings ?? []),
  warnings: r.warnings,
  // Runs stored before the total was kept count their list.
  warningsNotListed: Math.max(0, (r.warningsTotal ?? 0) - (r.warnings ?? []).length),
  error: r.error,
});
