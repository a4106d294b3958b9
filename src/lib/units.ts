import { createContext, useContext } from 'react';

/**
 * Display units. Stored and exchanged values stay SI (°C, mm); conversion happens only at the edge:
 * when a value is shown, exported for a user, or typed into a form in the user's unit.
 */
export type TemperatureUnit = 'C' | 'F';
export type RainUnit = 'mm' | 'in';
export interface UnitPreferences {
  temperature: TemperatureUnit;
  rain: RainUnit;
}
export const SI_UNITS: UnitPreferences = { temperature: 'C', rain: 'mm' };

/** °C → °F (exact: 9/5 and 32 by definition of the Fahrenheit scale). */
export const celsiusToFahrenheit = (c: number) => (c * 9) / 5 + 32;
export const fahrenheitToCelsius = (f: number) => ((f - 32) * 5) / 9;
/** A temperature difference (degree-days, ranges): no offset. */
export const celsiusDeltaToFahrenheit = (c: number) => (c * 9) / 5;
export const fahrenheitDeltaToCelsius = (f: number) => (f * 5) / 9;
/** 1 inch = 25.4 mm exactly (international yard and pound agreement, 1959). */
export const MM_PER_INCH = 25.4;
export const mmToInches = (mm: number) => mm / MM_PER_INCH;
export const inchesToMm = (inches: number) => inches * MM_PER_INCH;

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
