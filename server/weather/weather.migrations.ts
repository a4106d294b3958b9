import { WeatherIntake1796165205633 } from './migrations/1796165205633-WeatherIntake';
import { WeatherStationYears1796207332107 } from './migrations/1796207332107-WeatherStationYears';
import { WeatherUploadRefused1796262400000 } from './migrations/1796262400000-WeatherUploadRefused';
import { VoidWeatherDays1796403500000 } from './migrations/1796403500000-VoidWeatherDays';
import { HeldAndConflicts1796600100000 } from './migrations/1796600100000-HeldAndConflicts';

/** Reviewed migrations of the weather feature (TypeORM orders all migrations by their timestamp). */
export const weatherMigrations: Function[] = [
  WeatherIntake1796165205633, WeatherStationYears1796207332107, WeatherUploadRefused1796262400000, VoidWeatherDays1796403500000, HeldAndConflicts1796600100000,
];
