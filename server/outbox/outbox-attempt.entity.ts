import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { OutboxMessageEntity } from './outbox-message.entity';

/** The delivery log: one row per attempt to send an outbox message, with its outcome and error. */
@Entity({ name: 'outbox_attempts' })
@Index('outbox_attempts_message_idx', ['messageId', 'at'])
@Check('outbox_attempts_outcome_check', "outcome IN ('sent', 'retry', 'failed')")
export class OutboxAttemptEntity {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ name: 'message_id', type: 'uuid' })
  messageId: string;

  @ManyToOne(() => OutboxMessageEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'message_id' })
  message?: OutboxMessageEntity;

  @Column({ type: 'timestamptz', default: () => 'now()' })
  at: Date;

  @Column({ type: 'text' })
  outcome: 'sent' | 'retry' | 'failed';

  @Column({ type: 'text', nullable: true })
  error: string | null;

  @Column({ name: 'duration_ms', type: 'integer' })
  durationMs: number;
}
