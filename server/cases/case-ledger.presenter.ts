import type { CaseCountDto, DiseaseDto, RevisionDto } from '../../shared/api/cases.schema';
import type { CaseCountEntity } from './case-count.entity';
import type { CaseLedgerRepository } from './case-ledger.repository';
import type { DiseaseEntity } from './disease.entity';

export const presentDisease = (d: DiseaseEntity): DiseaseDto => ({ id: d.id, code: d.code, name: d.name, profileIds: d.profileIds });

export const presentCount = (c: CaseCountEntity): CaseCountDto => ({
  id: c.id,
  districtId: c.districtId,
  diseaseId: c.diseaseId,
  year: c.epiYear,
  week: c.epiWeek,
  cases: c.cases,
  confirmed: c.confirmed,
  probable: c.probable,
  ageBands: (c.ageBands as Record<string, number> | null) ?? null,
  version: c.version,
  late: c.late,
  reportedAt: c.reportedAt.toISOString(),
  updatedAt: c.updatedAt.toISOString(),
  voided: c.voidedAt ? { at: c.voidedAt.toISOString(), by: c.voidedBy, reason: c.voidReason ?? '' } : null,
});

type RevisionRow = Awaited<ReturnType<CaseLedgerRepository['revisions']>>[number];

export const presentRevision = (r: RevisionRow): RevisionDto => ({
  version: r.version,
  at: new Date(r.at).toISOString(),
  kind: r.kind,
  source: r.source,
  actor: r.actor_id ? { id: r.actor_id, displayName: r.display_name ?? '' } : null,
  old: r.old_values,
  new: r.new_values,
  reason: r.reason,
});

export const completenessOf = (expected: number, received: number, onTime: number) => ({
  expected,
  received,
  onTime,
  share: expected === 0 ? null : onTime / expected,
});
