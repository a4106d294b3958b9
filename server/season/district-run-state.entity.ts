import { Column, Entity, PrimaryColumn } from 'typeorm';

/**
 * What the last good season run saw of a district's inputs: a fingerprint of its weather, counts,
 * surveys and profiles. The incremental run recomputes only districts whose fingerprint changed.
 */
@Entity({ name: 'district_run_state' })
export class DistrictRunStateEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @Column({ name: 'season_year', type: 'integer' })
  seasonYear: number;

  @Column({ name: 'as_of', type: 'date' })
  asOf: string;

  @Column({ type: 'text' })
  fingerprint: string;

  @Column({ name: 'run_id', type: 'uuid' })
  runId: string;
}
