import { DistrictWeatherDayEntity } from './district-weather-day.entity';
import { DistrictWeatherSourceEntity } from './district-weather-source.entity';
import { WeatherObservationConflictEntity } from './weather-observation-conflict.entity';
import { WeatherObservationRevisionEntity } from './weather-observation-revision.entity';
import { WeatherStationYearEntity } from './weather-station-year.entity';
import { WeatherStationEntity } from './weather-station.entity';
import { WeatherUploadIssueEntity } from './weather-upload-issue.entity';
import { WeatherUploadEntity } from './weather-upload.entity';

/** Entities of the weather feature, added to the DataSource by server/db/entities.ts. */
export const weatherEntities: Function[] = [
  WeatherStationEntity,
  WeatherUploadEntity,
  WeatherUploadIssueEntity,
  WeatherStationYearEntity,
  WeatherObservationRevisionEntity,
  WeatherObservationConflictEntity,
  DistrictWeatherSourceEntity,
  DistrictWeatherDayEntity,
];
