import type { LookBackRunDto } from '../../shared/api/look-back.schema';
import type { LookBackRunEntity } from './look-back-run.entity';
import { failedCount } from './look-back.service';

export const presentLookBackRun = (r: LookBackRunEntity): LookBackRunDto => ({
  id: r.id,
  fromYear: r.fromYear,
  toYear: r.toYear,
  status: r.status,
  districtsTotal: r.districtsTotal,
  districtsDone: r.districtsDone,
  weeksWritten: r.weeksWritten,
  districtsFailed: failedCount(r.warnings ?? []),
  byPerson: r.requestedBy !== null,
  startedAt: new Date(r.startedAt).toISOString(),
  finishedAt: r.finishedAt ? new Date(r.finishedAt).toISOString() : null,
  warnings: r.warnings ?? [],
  error: r.error,
});
