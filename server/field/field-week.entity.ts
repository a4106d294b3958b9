import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { FieldWeekProposalRecord } from '../../shared/api/field.schema';
import { UserEntity } from '../users/user.entity';

export type FieldWeekStatus = 'draft' | 'awaiting_approval' | 'published';

/**
 * The Field week: the plan of one week (Monday–Friday), proposed by the solver, edited by the officer,
 * then published. `proposal` keeps what the solver said (every district's reason, the risk covered, the
 * Ladder week it used), so the screen can show why a district is in or out after edits.
 */
@Entity({ name: 'field_weeks' })
@Check('field_weeks_status_check', "status IN ('draft', 'awaiting_approval', 'published')")
export class FieldWeekEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** The Monday the week starts. */
  @Index('field_weeks_week_start_key', { unique: true })
  @Column({ name: 'week_start', type: 'date' })
  weekStart: string;

  @Column({ type: 'text', default: 'draft' })
  status: FieldWeekStatus;

  @Column({ type: 'jsonb' })
  proposal: FieldWeekProposalRecord;

  /** True once the officer changed the solver's days. */
  @Column({ type: 'boolean', default: false })
  edited: boolean;

  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'field_weeks_created_by_fkey' })
  creator?: UserEntity;

  @Column({ name: 'published_at', type: 'timestamptz', nullable: true })
  publishedAt: Date | null;

  @Column({ name: 'published_by', type: 'uuid', nullable: true })
  publishedBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'published_by', foreignKeyConstraintName: 'field_weeks_published_by_fkey' })
  publisher?: UserEntity;

  /** When approval is required: when and by whom the week was sent to the supervisors. */
  @Column({ name: 'submitted_at', type: 'timestamptz', nullable: true })
  submittedAt: Date | null;

  @Column({ name: 'submitted_by', type: 'uuid', nullable: true })
  submittedBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'submitted_by', foreignKeyConstraintName: 'field_weeks_submitted_by_fkey' })
  submitter?: UserEntity;

  /** The supervisor's last decision: approved (then published) or sent back with `reviewReason`. */
  @Column({ name: 'reviewed_at', type: 'timestamptz', nullable: true })
  reviewedAt: Date | null;

  @Column({ name: 'reviewed_by', type: 'uuid', nullable: true })
  reviewedBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'reviewed_by', foreignKeyConstraintName: 'field_weeks_reviewed_by_fkey' })
  reviewer?: UserEntity;

  @Column({ name: 'review_reason', type: 'text', nullable: true })
  reviewReason: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
