import { dayOfYear, parseIsoDate } from './dates';

/**
 * Day length from latitude and day of year: the CBM model of Forsythe, Rykiel, Stahl, Wu &
 * Schoolfield 1995, "A model comparison for daylength as a function of latitude and day of year",
 * Ecological Modelling 80:87–95 (eqs. 1–3):
 *   θ = 0.2163108 + 2·atan(0.9671396·tan(0.00860·(J − 186)))      revolution angle
 *   φ = asin(0.39795·cos θ)                                        sun's declination
 *   D = 24 − (24/π)·acos[(sin p + sin L·sin φ) / (cos L·cos φ)]    hours
 * 0.39795 is the sine of the axial tilt (≈ 23.45°); `axialTiltDeg` replaces it (a tilt of 0 with the
 * geometric definition gives 12 h everywhere, a property test). p is the day-length definition: the
 * sun's angle below the horizon at which the day begins and ends.
 * Polar day and night: the acos argument is held within [−1, 1] (24 h or 0 h).
 */

/** Day-length definitions (degrees of the sun below the horizon), as listed by Forsythe et al. 1995. */
export const DAY_LENGTH_DEFINITIONS = {
  /** Centre of the sun on the horizon. */
  geometric: 0,
  /** Top of the sun on the horizon, with the usual refraction correction (sunrise to sunset). */
  sunrise: 0.8333,
  /** Civil twilight. */
  civil: 6,
  nautical: 12,
  astronomical: 18,
} as const;
export type DayLengthDefinition = keyof typeof DAY_LENGTH_DEFINITIONS;

export interface DayLengthOptions {
  /** A named definition or the angle p in degrees; default 'sunrise'. */
  definition?: DayLengthDefinition | number;
  /** Axial tilt in degrees; default: the paper's constant 0.39795 = sin(≈23.45°). */
  axialTiltDeg?: number;
}

const RAD = Math.PI / 180;

export function definitionAngle(definition: DayLengthDefinition | number | undefined): number {
  if (definition === undefined) return DAY_LENGTH_DEFINITIONS.sunrise;
  if (typeof definition === 'number') return definition;
  const p = DAY_LENGTH_DEFINITIONS[definition];
  if (p === undefined) throw new RangeError(`unknown day-length definition: ${String(definition)}`);
  return p;
}

/** sin and cos of the declination φ for J = 1…366, per sin(tilt) (cached; the season path reads it per day). */
const declinationCache = new Map<number, Float64Array>();
export function declinationTable(sinTilt: number): Float64Array {
  let t = declinationCache.get(sinTilt);
  if (!t) {
    t = new Float64Array(2 * 367);
    for (let j = 1; j <= 366; j++) {
      const theta = 0.2163108 + 2 * Math.atan(0.9671396 * Math.tan(0.0086 * (j - 186)));
      const phi = Math.asin(sinTilt * Math.cos(theta));
      t[2 * j] = Math.sin(phi);
      t[2 * j + 1] = Math.cos(phi);
    }
    if (declinationCache.size > 16) declinationCache.clear();
    declinationCache.set(sinTilt, t);
  }
  return t;
}

/**
 * Day length (hours) from precomputed parts: sin p, sin L, cos L and the declination table row of J.
 * Same formula as dayLengthFast.
 */
export function dayLengthFromParts(sinP: number, sinLat: number, cosLat: number, sinPhi: number, cosPhi: number): number {
  let x = (sinP + sinLat * sinPhi) / (cosLat * cosPhi);
  if (x > 1) x = 1;
  else if (x < -1) x = -1;
  else if (x !== x) x = 0;
  return 24 - (24 / Math.PI) * Math.acos(x);
}

/** Fast path: day length in hours for day-of-year J (1 = 1 January), p in degrees, sin(tilt). */
export function dayLengthFast(latDeg: number, dayOfYearJ: number, pDeg: number, sinTilt: number): number {
  const theta = 0.2163108 + 2 * Math.atan(0.9671396 * Math.tan(0.0086 * (dayOfYearJ - 186)));
  const phi = Math.asin(sinTilt * Math.cos(theta));
  const lat = latDeg * RAD;
  let x = (Math.sin(pDeg * RAD) + Math.sin(lat) * Math.sin(phi)) / (Math.cos(lat) * Math.cos(phi));
  if (x > 1) x = 1;
  else if (x < -1) x = -1;
  else if (x !== x) x = 0; // 0/0 at a pole with zero tilt and p = 0: the 12-hour limit
  return 24 - (24 / Math.PI) * Math.acos(x);
}

export function sinTiltOf(options?: DayLengthOptions): number {
  return options?.axialTiltDeg === undefined ? 0.39795 : Math.sin(options.axialTiltDeg * RAD);
}

/** Day length in hours at latitude `latDeg` (−90…90, north positive) on a YYYY-MM-DD date or a day of year. */
export function dayLength(latDeg: number, date: string | number, options?: DayLengthOptions): number {
  if (!Number.isFinite(latDeg) || latDeg < -90 || latDeg > 90) throw new RangeError('latitude must be within −90…90');
  const j = typeof date === 'number' ? date : dayOfYear(parseIsoDate(date));
  if (!Number.isInteger(j) || j < 1 || j > 366) throw new RangeError('day of year must be an integer 1…366');
  return dayLengthFast(latDeg, j, definitionAngle(options?.definition), sinTiltOf(options));
}
