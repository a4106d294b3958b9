import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { ActionDto, FlagReason, FlagStatus, MessageCode, MessageParams } from '../../shared/api/flags.schema';
import type { DriverResult } from '../../shared/tier';
import { DistrictEntity } from '../districts/district.entity';
import { UserEntity } from '../users/user.entity';

/**
 * A proposed warning for a district, waiting for a supervisor's sign-off. At most one open flag per
 * district and reason (a partial unique index, so two season runs cannot both raise it). `version`
 * goes up on every decision: sign-off is a conditional UPDATE … WHERE status = 'open'.
 */
@Entity({ name: 'flags' })
@Index('flags_status_created_idx', ['status', 'createdAt'])
@Index('flags_district_idx', ['districtId', 'createdAt'])
@Index('flags_open_key', ['districtId', 'reason'], { unique: true, where: "status = 'open'" })
@Check('flags_reason_check', "reason IN ('tier-rise', 'channel-above', 'case-alarm', 'manual')")
@Check('flags_source_check', "source IN ('season-run', 'manual')")
@Check('flags_status_check', "status IN ('open', 'lapsed', 'approved', 'rejected')")
@Check('flags_decision_check', "(status IN ('open', 'lapsed')) = (decided_at IS NULL)")
@Check('flags_message_code_check', "message_code IS NULL OR message_code IN ('diapause', 'zero-suitability', 'no-signal', 'case-signal-only', 'case-led', 'weather-led', 'larval-led', 'mixed', 'custom')")
export class FlagEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @Column({ type: 'text' })
  reason: FlagReason;

  @Column({ type: 'text' })
  source: 'season-run' | 'manual';

  @Column({ type: 'text', default: 'open' })
  status: FlagStatus;

  @Column({ type: 'text', nullable: true })
  tier: string | null;

  @Column({ name: 'previous_tier', type: 'text', nullable: true })
  previousTier: string | null;

  @Column({ name: 'epi_year', type: 'integer', nullable: true })
  epiYear: number | null;

  @Column({ name: 'epi_week', type: 'integer', nullable: true })
  epiWeek: number | null;

  /** The season run that raised it (none for a flag raised by hand). */
  @Column({ name: 'run_id', type: 'uuid', nullable: true })
  runId: string | null;

  /** The drivers at the time, as the season run stored them. */
  @Column({ type: 'jsonb' })
  drivers: DriverResult[];

  /** The suggested message in English, as written when the flag was raised (kept for the record and the audit). */
  @Column({ name: 'suggested_message', type: 'text' })
  suggestedMessage: string;

  /** The suggested message as a code and the numbers it is worded from (shared/flags/advisory-message.ts); null on flags raised before. */
  @Column({ name: 'message_code', type: 'text', nullable: true })
  messageCode: MessageCode | null;

  @Column({ name: 'message_params', type: 'jsonb', nullable: true })
  messageParams: MessageParams | null;

  @Column({ type: 'jsonb' })
  actions: ActionDto[];

  /** What the person who raised it by hand saw: an internal note, never public. */
  @Column({ type: 'text', nullable: true })
  note: string | null;

  /** The public message the person who raised it by hand wrote (null: composed from the numbers). */
  @Column({ name: 'public_message', type: 'text', nullable: true })
  publicMessage: string | null;

  @Column({ name: 'raised_by', type: 'uuid', nullable: true })
  raisedBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'raised_by' })
  raiser?: UserEntity;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'decided_by', type: 'uuid', nullable: true })
  decidedBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'decided_by' })
  decider?: UserEntity;

  @Column({ name: 'decided_at', type: 'timestamptz', nullable: true })
  decidedAt: Date | null;

  @Column({ name: 'decision_reason', type: 'text', nullable: true })
  decisionReason: string | null;

  @Column({ name: 'final_message', type: 'text', nullable: true })
  finalMessage: string | null;

  @Column({ type: 'integer', default: 1 })
  version: number;
}
