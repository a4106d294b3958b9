import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { WeatherStationEntity } from './weather-station.entity';

/**
 * A station's daily values for one calendar year in SI (°C, %, mm): one array element per day, index 1 =
 * 1 January, NULL where the station has no value. The intake merges by station and date, so a later
 * upload replaces, never duplicates (server/weather/station-years.repository.ts). The view
 * weather_observations shows the same values one row per station and day, for reading.
 */
// Every array holds one element per day of the year (migration 1796207332107-WeatherStationYears).
@Check(
  'weather_station_years_days_check',
  `cardinality("tmin") = make_date("year" + 1, 1, 1) - make_date("year", 1, 1)
   AND cardinality("tmax") = cardinality("tmin") AND cardinality("rh") = cardinality("tmin")
   AND cardinality("rain") = cardinality("tmin") AND cardinality("flags") = cardinality("tmin")
   AND cardinality("upload_ix") = cardinality("tmin")`,
)
@Entity({ name: 'weather_station_years' })
export class WeatherStationYearEntity {
  @PrimaryColumn({ name: 'station_id', type: 'uuid' })
  stationId: string;

  @PrimaryColumn({ type: 'integer' })
  year: number;

  @Column({ type: 'double precision', array: true })
  tmin: (number | null)[];

  @Column({ type: 'double precision', array: true })
  tmax: (number | null)[];

  @Column({ type: 'double precision', array: true })
  rh: (number | null)[];

  @Column({ type: 'double precision', array: true })
  rain: (number | null)[];

  /** Quality flags of each day as bits: 1 jump, 2 run, 4 spatial (FLAG_BITS). */
  @Column({ type: 'smallint', array: true })
  flags: number[];

  /** The intake that wrote each day: 1-based into `uploads`, 0 for none (no foreign key: see the migration). */
  @Column({ name: 'upload_ix', type: 'smallint', array: true })
  uploadIx: number[];

  @Column({ type: 'uuid', array: true })
  uploads: string[];

  @Column({ name: 'updated_at', type: 'timestamptz', default: () => 'now()' })
  updatedAt: Date;

  @ManyToOne(() => WeatherStationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'station_id' })
  station?: WeatherStationEntity;
}
