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
