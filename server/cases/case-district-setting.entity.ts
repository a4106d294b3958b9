import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';

/**
 * When a district started reporting to the Case ledger. Weeks ending before this day are refused. A
 * district without a row reports from the day it was created (districts.created_at).
 */
@Entity({ name: 'case_district_settings' })
export class CaseDistrictSettingEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @Column({ name: 'active_from', type: 'date' })
  activeFrom: string;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;
}
