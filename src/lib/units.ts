import { createContext, useContext } from 'react';
import {
  celsiusDeltaToFahrenheit, celsiusToFahrenheit, fahrenheitToCelsius, inchesToMm, mmToInches, type RainUnit, type TemperatureUnit,
} from '../../shared/units';

/**
 * Display units. Stored and exchanged values stay SI (°C, mm); conversion happens only at the edge
 * (shared/units.ts): when a value is shown, exported for a user, or typed into a form in the user's unit.
 */
export type { RainUnit, TemperatureUnit };

export interface UnitPreferences {
  temperature: TemperatureUnit;
  rain: RainUnit;
}
export const SI_UNITS: UnitPreferences = { temperature: 'C', rain: 'mm' };

export interface Units extends UnitPreferences {
  /** °C → the user's unit. */
  temperature: TemperatureUnit;
  toTemperature: (c: number) => number;
  fromTemperature: (x: number) => number;
  /** Temperature differences and degree-days (°C·day → °F·day). */
  toTemperatureDelta: (c: number) => number;
  toRain: (mm: number) => number;
  fromRain: (x: number) => number;
  /** "°C" or "°F"; "mm" or "in". */
  temperatureSymbol: string;
  degreeDaySymbol: string;
  rainSymbol: string;
  /** Decimals to show for rain in this unit (inches need two). */
  rainDigits: number;
}

export function unitsFor(p: UnitPreferences): Units {
  const f = p.temperature === 'F';
  const inch = p.rain === 'in';
  return {
    ...p,
    toTemperature: f ? celsiusToFahrenheit : (c) => c,
    fromTemperature: f ? fahrenheitToCelsius : (x) => x,
    toTemperatureDelta: f ? celsiusDeltaToFahrenheit : (c) => c,
    toRain: inch ? mmToInches : (mm) => mm,
    fromRain: inch ? inchesToMm : (x) => x,
    temperatureSymbol: f ? '°F' : '°C',
    degreeDaySymbol: f ? '°F·d' : '°C·d',
    rainSymbol: inch ? 'in' : 'mm',
    rainDigits: inch ? 2 : 1,
  };
}

export const UnitsContext = createContext<Units>(unitsFor(SI_UNITS));

/** The signed-in user's display units (SI outside the signed-in layout). */
export function useUnits(): Units {
  return useContext(UnitsContext);
}
