import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { UserEntity } from '../users/user.entity';

/** One larval survey as a community worker or health officer filled it in. The id comes from the browser (idempotent resubmission). */
@Entity({ name: 'larval_surveys' })
@Index('larval_surveys_district_week_idx', ['districtId', 'epiYear', 'epiWeek'])
@Check('larval_surveys_counts_check', 'houses_inspected >= 0 AND houses_positive >= 0 AND containers_inspected >= 0 AND containers_positive >= 0 AND (pupae IS NULL OR pupae >= 0)')
@Check('larval_surveys_void_check', '(voided_at IS NULL) = (void_reason IS NULL)')
@Check('larval_surveys_houses_check', 'houses_positive <= houses_inspected')
@Check('larval_surveys_containers_check', 'containers_positive <= containers_inspected')
export class LarvalSurveyEntity {
  /** Generated in the browser (UUID): a repeated submission of the same survey finds this row. */
  @PrimaryColumn({ type: 'uuid' })
  id: string;

  @Column({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @Column({ type: 'text' })
  locality: string;

  @Column({ name: 'survey_date', type: 'date' })
  surveyDate: string;

  @Column({ name: 'epi_year', type: 'integer' })
  epiYear: number;

  @Column({ name: 'epi_week', type: 'integer' })
  epiWeek: number;

  @Column({ name: 'houses_inspected', type: 'integer' })
  housesInspected: number;

  @Column({ name: 'houses_positive', type: 'integer' })
  housesPositive: number;

  @Column({ name: 'containers_inspected', type: 'integer' })
  containersInspected: number;

  @Column({ name: 'containers_positive', type: 'integer' })
  containersPositive: number;

  @Column({ type: 'integer', nullable: true })
  pupae: number | null;

  @Column({ name: 'container_types', type: 'text', array: true, default: () => "'{}'" })
  containerTypes: string[];

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ name: 'submitted_by', type: 'uuid', nullable: true })
  submittedBy: string | null;

  @Column({ name: 'submitted_at', type: 'timestamptz' })
  submittedAt: Date;

  /** Voided (entered in error): the row stays readable in lists, history and audit, and counts nowhere. */
  @Column({ name: 'voided_at', type: 'timestamptz', nullable: true })
  voidedAt: Date | null;

  @Column({ name: 'voided_by', type: 'uuid', nullable: true })
  voidedBy: string | null;

  @Column({ name: 'void_reason', type: 'text', nullable: true })
  voidReason: string | null;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'submitted_by' })
  submitter?: UserEntity;
}
