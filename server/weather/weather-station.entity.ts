import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';

/** A weather station. Its district is derived from its position inside a district boundary (never typed in). */
@Entity({ name: 'weather_stations' })
@Check('weather_stations_lat_check', 'latitude BETWEEN -90 AND 90')
@Check('weather_stations_lon_check', 'longitude BETWEEN -180 AND 180')
@Check('weather_stations_active_check', 'active_to IS NULL OR active_from IS NULL OR active_from <= active_to')
@Index('weather_stations_district_idx', ['districtId'])
export class WeatherStationEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('weather_stations_code_key', { unique: true })
  @Column({ type: 'text' })
  code: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'double precision' })
  latitude: number;

  @Column({ type: 'double precision' })
  longitude: number;

  /** Metres above sea level. */
  @Column({ type: 'double precision', nullable: true })
  elevation: number | null;

  @Column({ name: 'active_from', type: 'date', nullable: true })
  activeFrom: string | null;

  @Column({ name: 'active_to', type: 'date', nullable: true })
  activeTo: string | null;

  @Column({ name: 'is_demo', type: 'boolean', default: false })
  isDemo: boolean;

  /** The district whose boundary contains the station; null when it lies in none. */
  @Column({ name: 'district_id', type: 'uuid', nullable: true })
  districtId: string | null;

  @ManyToOne(() => DistrictEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
