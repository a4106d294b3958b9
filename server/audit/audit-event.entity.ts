import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Who changed what, when, with the value before and after. Written in the same transaction as the change. */
@Entity({ name: 'audit_events' })
@Index('audit_events_entity_idx', ['entity', 'entityId'])
export class AuditEventEntity {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @CreateDateColumn({ type: 'timestamptz' })
  at: Date;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId: string | null;

  @Column({ type: 'text' })
  action: string;

  @Column({ type: 'text' })
  entity: string;

  @Column({ name: 'entity_id', type: 'text' })
  entityId: string;

  @Column({ type: 'jsonb', nullable: true })
  before: unknown;

  @Column({ type: 'jsonb', nullable: true })
  after: unknown;

  @Column({ type: 'text', nullable: true })
  reason: string | null;
}
