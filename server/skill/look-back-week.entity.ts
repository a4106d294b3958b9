import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { LookBackRunEntity } from './look-back-run.entity';

/**
 * One replayed district-week of a Look-back: the tier the season run would have shown as of the
 * week's last day with only the data known then. Kept apart from the live `district_tiers`.
 */
@Entity({ name: 'look_back_weeks' })
@Index('look_back_weeks_district_idx', ['districtId'])
export class LookBackWeekEntity {
  @PrimaryColumn({ name: 'run_id', type: 'uuid' })
  runId: string;

  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ name: 'epi_year', type: 'integer' })
  epiYear: number;

  @PrimaryColumn({ name: 'epi_week', type: 'integer' })
  epiWeek: number;

  /** The day the week was replayed as of (its last day). */
  @Column({ name: 'as_of', type: 'date' })
  asOf: string;

  @Column({ type: 'text' })
  tier: string;

  @Column({ type: 'double precision' })
  score: number;

  @Column({ type: 'jsonb' })
  drivers: unknown;

  @ManyToOne(() => LookBackRunEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'run_id' })
  run?: LookBackRunEntity;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;
}
