import type { EntityManager } from 'typeorm';
import { AuditEventEntity } from './audit-event.entity';

export interface AuditRecord {
  actorId: string | null;
  action: string;
  entity: string;
  entityId: string;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
}

/** Write an audit event with the caller's transaction manager, so the change and its record land together. */
export async function recordAudit(manager: EntityManager, record: AuditRecord): Promise<void> {
  await manager.insert(AuditEventEntity, {
    actorId: record.actorId,
    action: record.action,
    entity: record.entity,
    entityId: record.entityId,
    before: (record.before ?? null) as object,
    after: (record.after ?? null) as object,
    reason: record.reason ?? null,
  });
}

/**
 * Many audit events in set-based inserts of at most 1,000 rows (an import or a region-wide assignment
 * audits thousands of districts; one insert per event would be thousands of round trips).
 */
export async function recordAudits(manager: EntityManager, records: AuditRecord[]): Promise<void> {
  for (let i = 0; i < records.length; i += 1000) {
    const chunk = records.slice(i, i + 1000);
    await manager.query(
      `INSERT INTO audit_events (actor_id, action, entity, entity_id, before, after, reason)
       SELECT * FROM unnest($1::uuid[], $2::text[], $3::text[], $4::text[], $5::jsonb[], $6::jsonb[], $7::text[])`,
      [
        chunk.map((r) => r.actorId), chunk.map((r) => r.action), chunk.map((r) => r.entity), chunk.map((r) => r.entityId),
        chunk.map((r) => (r.before == null ? null : JSON.stringify(r.before))),
        chunk.map((r) => (r.after == null ? null : JSON.stringify(r.after))),
        chunk.map((r) => r.reason ?? null),
      ],
    );
  }
}
