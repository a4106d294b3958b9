import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { AdvisoryEntity } from '../advisories/advisory.entity';
import { BulletinDigestEntity } from '../bulletins/bulletin-digest.entity';
import { BulletinEntity } from '../bulletins/bulletin.entity';
import { UserEntity } from '../users/user.entity';

export type OutboxKind = 'advisory' | 'bulletin' | 'invite' | 'password-reset' | 'field-week';
export type OutboxStatus = 'pending' | 'sent' | 'failed';

/**
 * A mail to send, written in the same transaction as what caused it; the outbox worker sends it
 * (server/outbox/outbox.worker.ts). `message_id` is the stable Message-ID header: a re-send after a
 * crash between sending and marking is recognisably the same message.
 */
@Entity({ name: 'outbox_messages' })
@Index('outbox_messages_due_idx', ['status', 'nextAttemptAt'])
@Index('outbox_messages_created_idx', ['createdAt'])
@Check('outbox_messages_kind_check', "kind IN ('advisory', 'bulletin', 'invite', 'password-reset', 'field-week')")
@Check('outbox_messages_status_check', "status IN ('pending', 'sent', 'failed')")
export class OutboxMessageEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  kind: OutboxKind;

  @Index('outbox_messages_message_id_key', { unique: true })
  @Column({ name: 'message_id', type: 'text' })
  messageId: string;

  @Column({ name: 'to_address', type: 'text' })
  toAddress: string;

  @Column({ name: 'user_id', type: 'uuid', nullable: true })
  userId: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'user_id' })
  user?: UserEntity;

  @Column({ type: 'text' })
  subject: string;

  @Column({ name: 'text_body', type: 'text' })
  textBody: string;

  @Column({ name: 'html_body', type: 'text' })
  htmlBody: string;

  @Column({ type: 'jsonb', default: () => "'{}'" })
  headers: Record<string, string>;

  /** The bulletin whose PDF goes attached (kept once per district and week, not per recipient). */
  @Column({ name: 'bulletin_id', type: 'uuid', nullable: true })
  bulletinId: string | null;

  @ManyToOne(() => BulletinEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'bulletin_id' })
  bulletin?: BulletinEntity;

  /** The person's weekly digest whose PDF goes attached (one bulletin per person and week). */
  @Column({ name: 'digest_id', type: 'uuid', nullable: true })
  digestId: string | null;

  @ManyToOne(() => BulletinDigestEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'digest_id' })
  digest?: BulletinDigestEntity;

  @Column({ name: 'advisory_id', type: 'uuid', nullable: true })
  advisoryId: string | null;

  @ManyToOne(() => AdvisoryEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'advisory_id' })
  advisory?: AdvisoryEntity;

  @Column({ type: 'text', default: 'pending' })
  status: OutboxStatus;

  @Column({ type: 'integer', default: 0 })
  attempts: number;

  @Column({ name: 'next_attempt_at', type: 'timestamptz', default: () => 'now()' })
  nextAttemptAt: Date;

  @Column({ name: 'last_error', type: 'text', nullable: true })
  lastError: string | null;

  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true })
  sentAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
