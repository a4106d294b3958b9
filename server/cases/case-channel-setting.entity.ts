import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { DiseaseEntity } from './disease.entity';

/** Per district and disease: the prior seasons left out of the endemic channel as epidemic years. */
@Entity({ name: 'case_channel_settings' })
export class CaseChannelSettingEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ name: 'disease_id', type: 'uuid' })
  diseaseId: string;

  @Column({ name: 'excluded_years', type: 'integer', array: true, default: () => "'{}'" })
  excludedYears: number[];

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @Column({ name: 'updated_by', type: 'uuid', nullable: true })
  updatedBy: string | null;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @ManyToOne(() => DiseaseEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'disease_id' })
  disease?: DiseaseEntity;
}
