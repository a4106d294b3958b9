import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { UserEntity } from '../users/user.entity';

/**
 * One piece of field work as a team member recorded it (issue 19, item 3). The id comes from the browser,
 * as a larval survey's does, so a record sent again from the offline queue is stored once.
 */
@Entity({ name: 'field_records' })
@Index('field_records_district_date_idx', ['districtId', 'workDate'])
@Index('field_records_date_idx', ['workDate'])
@Check('field_records_kind_check', "kind IN ('source-reduction', 'larviciding', 'indoor-residual-spraying', 'space-spraying', 'case-investigation', 'community-clean-up', 'health-education')")
@Check('field_records_coverage_check', '(houses_visited IS NULL OR houses_visited >= 0) AND (containers IS NULL OR containers >= 0) AND (area_m2 IS NULL OR area_m2 >= 0)')
@Check('field_records_amount_check', '(amount IS NULL OR (amount > 0 AND amount_unit IS NOT NULL))')
@Check('field_records_unit_check', "amount_unit IS NULL OR amount_unit IN ('ml', 'l', 'g', 'kg')")
export class FieldRecordEntity {
  @PrimaryColumn({ type: 'uuid', primaryKeyConstraintName: 'field_records_pkey' })
  id: string;

  @Column({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @Column({ type: 'text' })
  locality: string;

  @Column({ name: 'work_date', type: 'date' })
  workDate: string;

  @Column({ type: 'text' })
  kind: string;

  @Column({ name: 'houses_visited', type: 'integer', nullable: true })
  housesVisited: number | null;

  /** Containers treated or removed. */
  @Column({ type: 'integer', nullable: true })
  containers: number | null;

  @Column({ name: 'area_m2', type: 'double precision', nullable: true })
  areaM2: number | null;

  @Column({ type: 'text', nullable: true })
  product: string | null;

  @Column({ type: 'double precision', nullable: true })
  amount: number | null;

  @Column({ name: 'amount_unit', type: 'text', nullable: true })
  amountUnit: string | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ name: 'submitted_by', type: 'uuid', nullable: true })
  submittedBy: string | null;

  @Column({ name: 'submitted_at', type: 'timestamptz' })
  submittedAt: Date;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id', foreignKeyConstraintName: 'field_records_district_id_fkey' })
  district?: DistrictEntity;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'submitted_by', foreignKeyConstraintName: 'field_records_submitted_by_fkey' })
  submitter?: UserEntity;
}
