import { Check, Column, Entity, PrimaryColumn, JoinColumn, ManyToOne } from 'typeorm';
import { WeatherStationEntity } from './weather-station.entity';
import { DistrictEntity } from '../districts/district.entity';

/**
 * Where a district's weather comes from: the stations inside its boundary (equal weights), or, for a
 * district without one, the nearest stations by inverse-distance weighting.
 */
@Entity({ name: 'district_weather_sources' })
@Check('district_weather_sources_method_check', "method IN ('inside', 'interpolated')")
export class DistrictWeatherSourceEntity {
  @PrimaryColumn({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @PrimaryColumn({ name: 'station_id', type: 'uuid' })
  stationId: string;

  @Column({ type: 'text' })
  method: 'inside' | 'interpolated';

  @Column({ name: 'distance_km', type: 'double precision' })
  distanceKm: number;

  @Column({ type: 'double precision' })
  weight: number;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @ManyToOne(() => WeatherStationEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'station_id' })
  station?: WeatherStationEntity;
}
