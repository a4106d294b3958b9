import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { UserEntity } from '../users/user.entity';

/** A district's epidemiological week, closed (locked): its counts change only through a correction with a reason. */
@Entity({ name: 'case_week_closures' })
@Check('case_week_closures_week_check', 'epi_week BETWEEN 1 AND 53')
export class CaseWeekClosureEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ name: 'epi_year', type: 'integer' })
  epiYear: number;

  @PrimaryColumn({ name: 'epi_week', type: 'integer' })
  epiWeek: number;

  @Column({ name: 'closed_at', type: 'timestamptz' })
  closedAt: Date;

  @Column({ name: 'closed_by', type: 'uuid', nullable: true })
  closedBy: string | null;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @ManyToOne(() => UserEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'closed_by' })
  closer?: UserEntity;
}
