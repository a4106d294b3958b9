import { Column, Entity, PrimaryColumn, JoinColumn, ManyToOne } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';

/**
 * A district's derived daily series. Null temperatures mark a missing day (a gap longer than the fill
 * limit); `filled` marks a day interpolated across a short gap. Recomputed whenever its stations' data changes.
 */
@Entity({ name: 'district_weather_days' })
export class DistrictWeatherDayEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ type: 'date' })
  date: string;

  @Column({ type: 'double precision', nullable: true })
  tmin: number | null;

  @Column({ type: 'double precision', nullable: true })
  tmax: number | null;

  @Column({ type: 'double precision', nullable: true })
  rh: number | null;

  @Column({ type: 'double precision', nullable: true })
  rain: number | null;

  @Column({ type: 'boolean', default: false })
  filled: boolean;

  /** How many stations reported that day (0 for a filled or missing day). */
  @Column({ name: 'station_count', type: 'integer', default: 0 })
  stationCount: number;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;
}
