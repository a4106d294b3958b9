import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { WeatherStationEntity } from './weather-station.entity';

/**
 * A value a feed pull or an upload brought for a station-day corrected by hand: hand corrections win, so
 * the correction stands and the new value waits here until a person keeps the correction or takes it
 * (issue 16, "Hand corrections win"). At most one open conflict per station and day.
 */
@Entity({ name: 'weather_observation_conflicts' })
@Check('weather_observation_conflicts_choice_check', "choice IS NULL OR choice IN ('keep', 'take')")
@Index('weather_observation_conflicts_open_idx', ['stationId', 'date'], { unique: true, where: 'resolved_at IS NULL' })
export class WeatherObservationConflictEntity {
  @PrimaryGeneratedColumn({ type: 'bigint', primaryKeyConstraintName: 'PK_weather_observation_conflicts' })
  id: string;

  @Column({ name: 'station_id', type: 'uuid' })
  stationId: string;

  @Column({ type: 'date' })
  date: string;

  /** The incoming values (°C, %, mm). */
  @Column({ type: 'double precision' })
  tmin: number;

  @Column({ type: 'double precision' })
  tmax: number;

  @Column({ type: 'double precision', nullable: true })
  rh: number | null;

  @Column({ type: 'double precision', nullable: true })
  rain: number | null;

  /** The intake (feed pull or upload) that brought them. */
  @Column({ name: 'upload_id', type: 'uuid' })
  uploadId: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'resolved_at', type: 'timestamptz', nullable: true })
  resolvedAt: Date | null;

  @Column({ name: 'resolved_by', type: 'uuid', nullable: true })
  resolvedBy: string | null;

  /** keep: the hand correction stays; take: the incoming values replace it (the correction goes to the revisions). */
  @Column({ type: 'text', nullable: true })
  choice: 'keep' | 'take' | null;

  @Column({ type: 'text', nullable: true })
  reason: string | null;

  @ManyToOne(() => WeatherStationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'station_id', foreignKeyConstraintName: 'FK_weather_observation_conflicts_station' })
  station?: WeatherStationEntity;
}
