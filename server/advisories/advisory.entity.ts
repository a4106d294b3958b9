import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { ActionDto, MessageCode, MessageParams } from '../../shared/api/flags.schema';
import { DistrictEntity } from '../districts/district.entity';
import { FlagEntity } from '../flags/flag.entity';
import { UserEntity } from '../users/user.entity';

/** An approved flag as sent to the people of a district. Current until `expires_at` (then it leaves the bulletin). */
@Entity({ name: 'advisories' })
@Index('advisories_district_idx', ['districtId', 'issuedAt'])
@Check('advisories_message_code_check', "message_code IS NULL OR message_code IN ('diapause', 'zero-suitability', 'no-signal', 'case-signal-only', 'case-led', 'weather-led', 'larval-led', 'mixed', 'custom')")
export class AdvisoryEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('advisories_flag_key', { unique: true })
  @Column({ name: 'flag_id', type: 'uuid' })
  flagId: string;

  @ManyToOne(() => FlagEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'flag_id' })
  flag?: FlagEntity;

  @Column({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @Column({ type: 'text', nullable: true })
  tier: string | null;

  /** The message in English (or as the supervisor wrote it), for the record. */
  @Column({ type: 'text' })
  message: string;

  /** The message as a code and its numbers, worded in each reader's language; null on advisories issued before. */
  @Column({ name: 'message_code', type: 'text', nullable: true })
  messageCode: MessageCode | null;

  @Column({ name: 'message_params', type: 'jsonb', nullable: true })
  messageParams: MessageParams | null;

  @Column({ type: 'jsonb' })
  actions: ActionDto[];

  @Column({ name: 'issued_by', type: 'uuid', nullable: true })
  issuedBy: string | null;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'issued_by' })
  issuer?: UserEntity;

  @Column({ name: 'issued_at', type: 'timestamptz', default: () => 'now()' })
  issuedAt: Date;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;
}
