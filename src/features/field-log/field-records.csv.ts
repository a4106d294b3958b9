import type { FieldRecordDto } from '../../../shared/api/field-records.schema';
import { toCsv } from '../../lib/csv';

/**
 * A week's field records as CSV, one row per record, oldest first: date (YYYY-MM-DD), district code and
 * name, locality, kind of work (in the words given: the interface language), houses visited, containers
 * treated or removed, area m², product, amount, unit, notes, recorded by. A coverage field left empty
 * stays an empty cell, never 0.
 */
export function fieldRecordsCsv(records: readonly FieldRecordDto[], words: { header: readonly string[]; kind: (kind: string) => string }): string {
  const rows = [...records]
    .sort((a, b) => a.date.localeCompare(b.date) || a.district.code.localeCompare(b.district.code) || a.submittedAt.localeCompare(b.submittedAt))
    .map((r) => [
      r.date,
      r.district.code,
      r.district.name,
      r.locality,
      words.kind(r.kind),
      r.housesVisited,
      r.containers,
      r.areaM2,
      r.product,
      r.amount,
      r.amountUnit,
      r.notes,
      r.submittedBy?.name ?? null,
    ]);
  return toCsv(words.header, rows);
}
