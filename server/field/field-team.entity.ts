import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { WorkKind } from '../../shared/field/work-kinds';
import { DistrictEntity } from '../districts/district.entity';

/** A field team the officer keeps: where it is based, what it is trained for, how many district-days it works a week. */
@Entity({ name: 'field_teams' })
@Check('field_teams_days_check', 'days_per_week BETWEEN 1 AND 7')
@Index('field_teams_base_idx', ['baseDistrictId'])
export class FieldTeamEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('field_teams_name_key', { unique: true })
  @Column({ type: 'text' })
  name: string;

  @Column({ name: 'base_district_id', type: 'uuid' })
  baseDistrictId: string;

  @ManyToOne(() => DistrictEntity, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'base_district_id', foreignKeyConstraintName: 'field_teams_base_district_id_fkey' })
  baseDistrict?: DistrictEntity;

  /** The kinds of work the team is trained for (shared/field/work-kinds.ts). */
  @Column({ type: 'text', array: true })
  kinds: WorkKind[];

  @Column({ name: 'days_per_week', type: 'integer' })
  daysPerWeek: number;

  /** Set when the officer retires the team: kept for the weeks that name it, left out of new proposals. */
  @Column({ name: 'retired_at', type: 'timestamptz', nullable: true })
  retiredAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
