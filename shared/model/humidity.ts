/**
 * Humidity. Magnus form with the constants of Alduchov & Eskridge 1996, "Improved Magnus form
 * approximation of saturation vapor pressure", J. Appl. Meteorol. 35:601–609:
 *   es(T) = 6.1094·exp(17.625·T / (T + 243.04)) hPa.
 * FAO Irrigation and Drainage Paper 56 (Allen, Pereira, Raes & Smith 1998), eq. 11:
 *   e°(T) = 0.6108·exp(17.27·T / (T + 237.3)) kPa.
 * Dew point inverts the Magnus form; RH from dew point is es(Td)/es(T); the vapour pressure deficit is
 * es(T)·(1 − RH/100).
 */

export const MAGNUS = { a: 6.1094, b: 17.625, c: 243.04 } as const;

/** Saturation vapour pressure over water, hPa (Magnus, Alduchov & Eskridge 1996). */
export function saturationVapourPressure(tempC: number): number {
  return MAGNUS.a * Math.exp((MAGNUS.b * tempC) / (tempC + MAGNUS.c));
}

/** Saturation vapour pressure, kPa (FAO-56 eq. 11). */
export function saturationVapourPressureFao56(tempC: number): number {
  return 0.6108 * Math.exp((17.27 * tempC) / (tempC + 237.3));
}

/** Dew point (°C) from air temperature (°C) and relative humidity (%, 0 < RH ≤ 100), inverting Magnus. */
export function dewPoint(tempC: number, rhPercent: number): number {
  if (!(rhPercent > 0)) throw new RangeError('relative humidity must be above 0 %');
  const g = Math.log(rhPercent / 100) + (MAGNUS.b * tempC) / (MAGNUS.c + tempC);
  return (MAGNUS.c * g) / (MAGNUS.b - g);
}

/** Relative humidity (%) from air temperature and dew point (°C). */
export function relativeHumidityFromDewPoint(tempC: number, dewPointC: number): number {
  return (100 * saturationVapourPressure(dewPointC)) / saturationVapourPressure(tempC);
}

/** Vapour pressure deficit, hPa, from air temperature (°C) and relative humidity (%). */
export function vapourPressureDeficit(tempC: number, rhPercent: number): number {
  return saturationVapourPressure(tempC) * (1 - rhPercent / 100);
}
