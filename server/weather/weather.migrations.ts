import { WeatherIntake1796165205633 } from './migrations/1796165205633-WeatherIntake';

/** Reviewed migrations of the weather feature (TypeORM orders all migrations by their timestamp). */
export const weatherMigrations: Function[] = [WeatherIntake1796165205633];
