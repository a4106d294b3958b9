import { Column, Entity, PrimaryColumn } from 'typeorm';

/** The vector clock of one district, profile and day, as the season run stored it. */
@Entity({ name: 'vector_clock_days' })
export class VectorClockDayEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ name: 'profile_id', type: 'text' })
  profileId: string;

  @PrimaryColumn({ type: 'date' })
  date: string;

  @Column({ name: 'degree_days', type: 'real', nullable: true })
  degreeDays: number | null;

  @Column({ name: 'cumulative_degree_days', type: 'real' })
  cumulativeDegreeDays: number;

  @Column({ type: 'boolean' })
  complete: boolean;

  @Column({ type: 'real' })
  generations: number;

  @Column({ name: 'eip_days', type: 'real', nullable: true })
  eipDays: number | null;

  @Column({ type: 'real', nullable: true })
  survival: number | null;

  @Column({ name: 'survival_through_eip', type: 'real', nullable: true })
  survivalThroughEip: number | null;

  @Column({ name: 'eip_share', type: 'real', nullable: true })
  eipShare: number | null;

  @Column({ name: 'rvc', type: 'real', nullable: true })
  rvc: number | null;

  @Column({ name: 'rvc_low', type: 'real', nullable: true })
  rvcLow: number | null;

  @Column({ name: 'rvc_high', type: 'real', nullable: true })
  rvcHigh: number | null;

  @Column({ name: 'season_open', type: 'boolean' })
  seasonOpen: boolean;
}
