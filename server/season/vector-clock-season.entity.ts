import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';

/**
 * The vector clock of one district and profile over one season, as the season run stored it: one row
 * per season with one array per quantity, element i being the day `start_date + i` (i from 0; SQL
 * arrays count from 1). A NULL element is an unknown value (a weather gap), never zero.
 *
 * One row per season rather than one per day: a full run writes 5 rows per district instead of
 * about 1,700, so the run spends its time computing rather than inserting and indexing tuples (see
 * docs/tier.md, "Storage of the vector clock"). `SELECT … FROM vector_clock_seasons, unnest(…) WITH
 * ORDINALITY` gives the days back as rows (server/board/district-file.service.ts does).
 */
@Entity({ name: 'vector_clock_seasons' })
export class VectorClockSeasonEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ name: 'profile_id', type: 'text' })
  profileId: string;

  @PrimaryColumn({ name: 'season_year', type: 'integer' })
  seasonYear: number;

  @Column({ name: 'start_date', type: 'date' })
  startDate: string;

  @Column({ type: 'integer' })
  days: number;

  @Column({ name: 'degree_days', type: 'real', array: true })
  degreeDays: (number | null)[];

  @Column({ name: 'cumulative_degree_days', type: 'real', array: true })
  cumulativeDegreeDays: number[];

  @Column({ type: 'boolean', array: true })
  complete: boolean[];

  @Column({ type: 'real', array: true })
  generations: number[];

  @Column({ name: 'eip_days', type: 'real', array: true })
  eipDays: (number | null)[];

  @Column({ type: 'real', array: true })
  survival: (number | null)[];

  @Column({ name: 'survival_through_eip', type: 'real', array: true })
  survivalThroughEip: (number | null)[];

  @Column({ name: 'eip_share', type: 'real', array: true })
  eipShare: (number | null)[];

  @Column({ name: 'rvc', type: 'real', array: true })
  rvc: (number | null)[];

  @Column({ name: 'rvc_low', type: 'real', array: true })
  rvcLow: (number | null)[];

  @Column({ name: 'rvc_high', type: 'real', array: true })
  rvcHigh: (number | null)[];

  @Column({ name: 'season_open', type: 'boolean', array: true })
  seasonOpen: boolean[];

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;
}
