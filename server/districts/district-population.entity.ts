import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { DistrictEntity } from './district.entity';

@Entity({ name: 'district_populations' })
@Check('district_populations_population_check', 'population >= 0')
export class DistrictPopulationEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ type: 'integer' })
  year: number;

  @Column({ type: 'integer' })
  population: number;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;
}
