import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, JoinColumn, ManyToOne } from 'typeorm';
import { WeatherStationEntity } from './weather-station.entity';

/** The values a later intake replaced: a correction never overwrites silently (docs/product.md § Roles). */
@Entity({ name: 'weather_observation_revisions' })
@Index('weather_observation_revisions_key_idx', ['stationId', 'date'])
export class WeatherObservationRevisionEntity {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ name: 'station_id', type: 'uuid' })
  stationId: string;

  @Column({ type: 'date' })
  date: string;

  @Column({ type: 'double precision' })
  tmin: number;

  @Column({ type: 'double precision' })
  tmax: number;

  @Column({ type: 'double precision', nullable: true })
  rh: number | null;

  @Column({ type: 'double precision', nullable: true })
  rain: number | null;

  @Column({ type: 'text', array: true, default: () => "'{}'" })
  flags: string[];

  /** The intake that had written the old values. */
  @Column({ name: 'previous_upload_id', type: 'uuid', nullable: true })
  previousUploadId: string | null;

  /** The intake that replaced them. */
  @Column({ name: 'replaced_by_upload_id', type: 'uuid', nullable: true })
  replacedByUploadId: string | null;

  @Column({ name: 'replaced_by', type: 'uuid', nullable: true })
  replacedBy: string | null;

  @CreateDateColumn({ name: 'replaced_at', type: 'timestamptz' })
  replacedAt: Date;

  /** 'replaced' (a later intake wrote other values) or 'void' (the day was voided as entered in error). */
  @Column({ type: 'text', default: 'replaced' })
  kind: 'replaced' | 'void';

  /** Why the day was voided (null for a replacement by an intake). */
  @Column({ type: 'text', nullable: true })
  reason: string | null;

  @ManyToOne(() => WeatherStationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'station_id' })
  station?: WeatherStationEntity;
}
