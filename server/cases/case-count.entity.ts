import { Check, Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, Unique } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { UserEntity } from '../users/user.entity';
import { DiseaseEntity } from './disease.entity';

/** Age band → cases; the bands are the reporting form's (shared/api/cases.schema.ts AGE_BANDS). */
export type AgeBandCounts = Partial<Record<string, number>>;

/** One weekly count of the Case ledger: district × disease × epidemiological week. Changes go through revisions. */
@Entity({ name: 'case_counts' })
@Unique('case_counts_district_disease_week_key', ['districtId', 'diseaseId', 'epiYear', 'epiWeek'])
@Index('case_counts_disease_week_idx', ['diseaseId', 'epiYear', 'epiWeek'])
@Check('case_counts_cases_check', 'cases >= 0')
@Check('case_counts_confirmed_check', 'confirmed IS NULL OR (confirmed >= 0 AND confirmed <= cases)')
@Check('case_counts_probable_check', 'probable IS NULL OR (probable >= 0 AND probable <= cases)')
@Check('case_counts_split_check', 'coalesce(confirmed, 0) + coalesce(probable, 0) <= cases')
@Check('case_counts_week_check', 'epi_week BETWEEN 1 AND 53')
@Check('case_counts_void_check', '(voided_at IS NULL) = (void_reason IS NULL)')
@Check('case_counts_version_check', 'version >= 1')
export class CaseCountEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @Column({ name: 'disease_id', type: 'uuid' })
  diseaseId: string;

  @Column({ name: 'epi_year', type: 'integer' })
  epiYear: number;

  @Column({ name: 'epi_week', type: 'integer' })
  epiWeek: number;

  @Column({ type: 'integer' })
  cases: number;

  @Column({ type: 'integer', nullable: true })
  confirmed: number | null;

  @Column({ type: 'integer', nullable: true })
  probable: number | null;

  @Column({ name: 'age_bands', type: 'jsonb', nullable: true })
  ageBands: AgeBandCounts | null;

  /** 1 on entry, +1 on each correction. */
  @Column({ type: 'integer', default: 1 })
  version: number;

  /** When the count was first received: decides whether the report was late. */
  @Column({ name: 'reported_at', type: 'timestamptz' })
  reportedAt: Date;

  @Column({ name: 'reported_by', type: 'uuid', nullable: true })
  reportedBy: string | null;

  /** First received after the week's deadline or after the week was closed. */
  @Column({ type: 'boolean', default: false })
  late: boolean;

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

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

  @ManyToOne(() => DiseaseEntity, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'disease_id' })
  disease?: DiseaseEntity;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'reported_by' })
  reporter?: UserEntity;
}
