import type { FieldRecordDto } from '../../shared/api/field-records.schema';
import type { AmountUnit } from '../../shared/field/field-records';
import type { WorkKind } from '../../shared/field/work-kinds';
import type { FieldRecordRow } from './field-records.repository';

export const presentFieldRecord = (r: FieldRecordRow): FieldRecordDto => ({
  id: r.id,
  district: { id: r.districtId, code: r.districtCode, name: r.districtName },
  locality: r.locality,
  date: r.workDate,
  kind: r.kind as WorkKind,
  housesVisited: r.housesVisited,
  containers: r.containers,
  areaM2: r.areaM2,
  product: r.product,
  amount: r.amount,
  amountUnit: r.amountUnit as AmountUnit | null,
  notes: r.notes,
  submittedBy: r.submittedBy ? { id: r.submittedBy, name: r.submitterName ?? '' } : null,
  submittedAt: r.submittedAt.toISOString(),
});
