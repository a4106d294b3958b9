import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { ActionDto } from '../../shared/api/flags.schema';
import { DistrictEntity } from '../districts/district.entity';
import { FlagEntity } from '../flags/flag.entity';
import { UserEntity } from '../users/user.entity';

/** An approved flag as sent to the people of a district. Current until `expires_at` (then it leaves the bulletin). */
@Entity({ name: 'advisories' })
@Index('advisories_district_idx', ['districtId', 'issuedAt'])
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

  @Column({ type: 'text' })
  message: string;

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
