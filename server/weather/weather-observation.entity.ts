import { Check, Column, Entity, PrimaryColumn, JoinColumn, ManyToOne } from 'typeorm';
import { WeatherStationEntity } from './weather-station.entity';

/** A station's daily values in SI (°C, %, mm), keyed by station and date: a later upload replaces, never duplicates. */
@Entity({ name: 'weather_observations' })
@Check('weather_observations_values_check', 'tmin <= tmax AND (rh IS NULL OR rh BETWEEN 0 AND 100) AND (rain IS NULL OR rain >= 0)')
export class WeatherObservationEntity {
  @PrimaryColumn({ name: 'station_id', type: 'uuid' })
  stationId: string;

  @PrimaryColumn({ type: 'date' })
  date: string;

  @Column({ type: 'double precision' })
  tmin: number;

  @Column({ type: 'double precision' })
  tmax: number;

  @Column({ type: 'double precision', nullable: true })
  rh: number | null;

  @Column({ type: 'double precision', nullable: true })
  rain: number | null;

  /** Quality flags (kept but marked): 'jump', 'run', 'spatial'. */
  @Column({ type: 'text', array: true, default: () => "'{}'" })
  flags: string[];

  /** The intake that wrote the values (no foreign key: see the migration). */
  @Column({ name: 'upload_id', type: 'uuid', nullable: true })
  uploadId: string | null;

  @Column({ name: 'updated_at', type: 'timestamptz', default: () => 'now()' })
  updatedAt: Date;

  @ManyToOne(() => WeatherStationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'station_id' })
  station?: WeatherStationEntity;
}
