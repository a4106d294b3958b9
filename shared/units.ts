/**
 * Temperature and rain units. Broodcast stores and exchanges SI (°C, mm); these convert at the edges
 * only: a file uploaded in °F or inches, a value shown or exported in a user's units, a value typed in them.
 */
export const TEMPERATURE_UNITS = ['C', 'F'] as const;
export const RAIN_UNITS = ['mm', 'in'] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
export type RainUnit = (typeof RAIN_UNITS)[number];

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

/** A temperature given in `unit` → °C. */
export const toCelsius = (v: number, unit: TemperatureUnit) => (unit === 'F' ? fahrenheitToCelsius(v) : v);
/** °C → `unit`. */
export const fromCelsius = (c: number, unit: TemperatureUnit) => (unit === 'F' ? celsiusToFahrenheit(c) : c);
/** Rain given in `unit` → mm. */
export const toMillimetres = (v: number, unit: RainUnit) => (unit === 'in' ? inchesToMm(v) : v);
/** mm → `unit`. */
export const fromMillimetres = (mm: number, unit: RainUnit) => (unit === 'in' ? mmToInches(mm) : mm);
