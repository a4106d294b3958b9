/**
 * Weather intake rules, pure (no I/O): unit conversion, the row checks that reject, the gap filling of a
 * daily series, inverse-distance weights, and spreadsheet-safe CSV cells. Every limit and its source is in
 * docs/weather-intake.md; the server applies these on every path in (upload, feed, correction).
 */

import { calendarDay, dateProblem, DATE_MAX_YEAR, DATE_MIN_YEAR } from '../api/date.schema';
import { LIMITS as INPUT_LIMITS } from '../limits';
import { type RainUnit, type TemperatureUnit, toCelsius, toMillimetres } from '../units';

/** The longest value a row may hold (docs/security.md § Limits). */
const CSV_FIELD_MAX = INPUT_LIMITS.CSV_FIELD_MAX_CHARS;

export type TempUnit = TemperatureUnit;
export type { RainUnit };
export { toCelsius, toMillimetres };

/** Physical limits, in SI, beyond which a value is rejected (docs/weather-intake.md § Reject). */
export const LIMITS = {
  /** Lowest and highest air temperatures ever recorded at a surface station, rounded outwards (WMO archive). */
  tempMinC: -90,
  tempMaxC: 60,
  /** Largest 24-hour rainfall ever recorded, rounded up (WMO archive). */
  rainMaxMm: 1830,
  rhMin: 0,
  rhMax: 100,
} as const;

/** The columns a file may have; the first four are required, and either rh or dewpoint (or neither). */
export const REQUIRED_COLUMNS = ['station', 'date', 'tmin', 'tmax'] as const;
export const OPTIONAL_COLUMNS = ['rh', 'dewpoint', 'rain'] as const;
export const ALL_COLUMNS = [...REQUIRED_COLUMNS, ...OPTIONAL_COLUMNS] as const;
export type WeatherColumn = (typeof ALL_COLUMNS)[number];

export type ColumnIndex = Record<WeatherColumn, number>;

/** The header's problems, or the index of each column (-1 when absent). */
export function readHeader(header: string[]): { index: ColumnIndex } | { problem: string } {
  const names = header.map((h) => h.trim().toLowerCase());
  const unknown = names.filter((n) => !(ALL_COLUMNS as readonly string[]).includes(n));
  const missing = REQUIRED_COLUMNS.filter((c) => !names.includes(c));
  const looksLikeData = names.some((n) => /^\d{4}-\d{2}-\d{2}$/.test(n) || /^[-+]?\d+(\.\d+)?$/.test(n));
  if (looksLikeData)
    return { problem: `The first line must be the header (${ALL_COLUMNS.join(', ')}); it looks like a row of data.` };
  if (missing.length || unknown.length) {
    const parts = [
      missing.length ? `missing ${missing.join(', ')}` : '',
      unknown.length ? `unknown ${unknown.map((u) => JSON.stringify(u)).join(', ')}` : '',
    ].filter(Boolean);
    return {
      problem: `The columns are not right (${parts.join('; ')}). Expected station, date, tmin, tmax and optionally rh or dewpoint, and rain.`,
    };
  }
  const dup = names.find((n, i) => names.indexOf(n) !== i);
  if (dup) return { problem: `The column ${dup} appears twice.` };
  const index = Object.fromEntries(ALL_COLUMNS.map((c) => [c, names.indexOf(c)])) as ColumnIndex;
  return { index };
}


const TEMPERATURE_COLUMNS = new Set(['tmin', 'tmax', 'dewpoint']);

/**
 * The unit a row-report value is in: a rejected value is what the file said, in the upload's units; a
 * flagged, held or filled one is a stored value, in °C and mm. Null for a column without a unit.
 */
export function issueValueUnit(
  issue: { column: string; severity: string },
  upload: { tempUnit: TempUnit; rainUnit: RainUnit },
): { kind: 'temperature'; unit: TempUnit } | { kind: 'rain'; unit: RainUnit } | null {
  const asFiled = issue.severity === 'rejected';
  if (TEMPERATURE_COLUMNS.has(issue.column)) return { kind: 'temperature', unit: asFiled ? upload.tempUnit : 'C' };
  if (issue.column === 'rain') return { kind: 'rain', unit: asFiled ? upload.rainUnit : 'mm' };
  return null;
}

/** Relative humidity (%) of the day from its dew point and mean temperature (Magnus form, see docs), capped at 100. */
export function rhFromDewPoint(dewPointC: number, meanC: number): number {
  const es = (t: number) => 6.1094 * Math.exp((17.625 * t) / (t + 243.04));
  return Math.min(100, (100 * es(dewPointC)) / es(meanC));
}

/**
 * Days since 1970-01-01 of a YYYY-MM-DD date with a year from 1900 to 2100, or NaN: the shared date
 * type's check (shared/api/date.schema.ts), so 0099-06-15 is refused rather than read as 1999-06-15.
 */
export const dayOfIsoDate = (text: string): number => calendarDay(text);

export const isoOfDay = (day: number) => new Date(day * 86_400_000).toISOString().slice(0, 10);

export interface StationRef {
  id: string;
  /** The station's place in the caller's list, when it keeps one (the intake passes rows on by it). */
  index?: number;
  /** Day numbers; NaN when open. */
  activeFrom: number;
  activeTo: number;
}

export interface RowContext {
  stations: Map<string, StationRef>;
  tempUnit: TempUnit;
  rainUnit: RainUnit;
  /** Last acceptable day (today, UTC). */
  lastDay: number;
  /** Day numbers of the date texts met so far (filled by the checks). */
  dayCache?: Map<string, number>;
}

export interface RowIssue {
  rowNumber: number | null;
  station: string | null;
  date: string | null;
  column: string;
  value: string | null;
  severity: 'rejected' | 'flagged' | 'filled' | 'held';
  rule: string;
  reason: string;
  /** The figures a held line names (shared/weather/plausibility.ts). */
  params?: Record<string, string | number | null>;
}

export interface CheckedRow {
  stationId: string;
  /** StationRef.index of the row's station (-1 without one). */
  stationIndex: number;
  date: string;
  day: number;
  tmin: number;
  tmax: number;
  rh: number | null;
  rain: number | null;
}

/** The reject rules with a stable id, as the row report shows them. */
export const REJECT_RULES = {
  'unknown-station': 'No station has this code. Add the station first, or fix the code.',
  'bad-date': 'Not a calendar date written YYYY-MM-DD.',
  'date-range': `The year is outside ${DATE_MIN_YEAR} to ${DATE_MAX_YEAR} (a year such as 0099 is not read as 1999).`,
  'future-date': 'The date is after today: a daily value cannot be from the future.',
  'inactive-station': 'The station was not active on this date.',
  'missing-value': 'Tmin and Tmax are required.',
  'bad-number': 'Not a number (use digits and a decimal point, e.g. 21.5).',
  'temp-limits': `Outside the physical limits of air temperature (${LIMITS.tempMinC} to ${LIMITS.tempMaxC} °C).`,
  'tmin-above-tmax': 'Tmin is above Tmax.',
  'rh-range': 'Relative humidity must be between 0 and 100 %.',
  'dewpoint-limits': 'The dew point is above the day\'s Tmax (or outside the temperature limits), which is impossible.',
  'rain-limits': `Rainfall must be between 0 and ${LIMITS.rainMaxMm} mm in a day.`,
  'column-count': 'This row does not have as many fields as the header.',
  'duplicate-row': 'The same station and date appear earlier in this file; the first one was kept.',
  'field-too-long': `A value is longer than ${CSV_FIELD_MAX.toLocaleString('en')} characters, so the row was not read.`,
} as const;
export type RejectRule = keyof typeof REJECT_RULES;

/** The flag rules: the row is kept, and marked (docs/weather-intake.md § Flag). */
export const FLAG_RULES = {
  jump: 'Tmin or Tmax changed more than the set limit from the day before.',
  run: 'Tmin and Tmax identical for a long run of days (a stuck sensor?).',
  spatial: 'Differs strongly from the estimate of the neighbouring stations (inverse-distance weighted, adjusted for elevation).',
} as const;
export type FlagRule = keyof typeof FLAG_RULES;

/**
 * Check one row (fields in file order). Returns the row in SI, or null and its issues (every failing
 * column of the row is named, so one pass of corrections fixes it). With `out`, a good row is written
 * into it and `out` is returned (no object per row: the intake reads millions); read it before the next call.
 */
export function checkRow(rec: string[], col: ColumnIndex, rowNumber: number, ctx: RowContext, issues: RowIssue[], out?: CheckedRow): CheckedRow | null {
  return fastCheck(rec, col, ctx, out) ?? fullCheck(rec, col, rowNumber, ctx, issues);
}

const numOrNull = (raw: string | undefined): number | null | undefined => {
  if (raw === undefined) return null;
  const n = raw.length;
  // Trim only when an end is blank (most fields are not, and then no new string is made).
  const t = n > 0 && raw.charCodeAt(0) > 32 && raw.charCodeAt(n - 1) > 32 ? raw : raw.trim();
  if (t === '') return null;
  return plainNumber(t);
};

const POWERS_OF_TEN = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15];

/**
 * The value of a plain decimal number (an optional sign, then digits with an optional decimal point, or
 * a point and digits; no exponent, no hex, no spaces inside), or undefined for any other text. Read
 * character by character rather than with the pattern /^[-+]?(\d+\.?\d*|\.\d+)$/ and Number(): it
 * runs up to four times per row of a 2-million-row file, where the pattern and the conversion cost
 * about three times as much. With at most 15 digits the digits form an exact integer and dividing it by
 * an exact power of ten is correctly rounded (IEEE 754), so the value is the one Number() gives; longer
 * numbers go to Number().
 */
export function plainNumber(t: string): number | undefined {
  let i = 0;
  const n = t.length;
  let c = t.charCodeAt(0);
  const negative = c === 45;
  if (c === 43 || c === 45) i++; // + -
  let digits = 0;
  let decimals = -1;
  let value = 0;
  for (; i < n; i++) {
    c = t.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      digits++;
      value = value * 10 + (c - 48);
      if (decimals >= 0) decimals++;
    } else if (c === 46 && decimals < 0) decimals = 0;
    else return undefined;
  }
  if (digits === 0) return undefined;
  if (digits > 15) return +t;
  if (decimals > 0) value /= POWERS_OF_TEN[decimals];
  return negative ? -value : value;
}

const round2 = (x: number) => Math.round(x * 100) / 100;

/** The day number of a date text, remembered in the context (a file repeats the same few hundred dates for every station). */
function cachedDay(ctx: RowContext, text: string): number {
  const cache = (ctx.dayCache ??= new Map());
  let day = cache.get(text);
  if (day === undefined) {
    day = dayOfIsoDate(text);
    if (cache.size < 100_000) cache.set(text, day);
  }
  return day;
}

/**
 * The same rules without building any issue: the path of a good row (most rows), with no closures or
 * allocations beyond the result (none when the caller gives `out` to fill). Any doubt returns null, and fullCheck names the problems.
 */
function fastCheck(rec: string[], col: ColumnIndex, ctx: RowContext, out?: CheckedRow): CheckedRow | null {
  const station = ctx.stations.get(rec[col.station].trim());
  if (!station) return null;
  const dateText = rec[col.date].trim();
  const day = cachedDay(ctx, dateText);
  if (!(day <= ctx.lastDay) || day < station.activeFrom || day > station.activeTo) return null;
  const a = numOrNull(rec[col.tmin]);
  const b = numOrNull(rec[col.tmax]);
  if (a === null || a === undefined || b === null || b === undefined) return null;
  const f = ctx.tempUnit === 'F';
  const tmin = f ? round2(toCelsius(a, 'F')) : a;
  const tmax = f ? round2(toCelsius(b, 'F')) : b;
  if (!(tmin >= LIMITS.tempMinC && tmax <= LIMITS.tempMaxC && tmin <= tmax)) return null;
  let rh = col.rh < 0 ? null : numOrNull(rec[col.rh]);
  if (rh === undefined || (rh !== null && !(rh >= 0 && rh <= 100))) return null;
  if (rh === null && col.dewpoint >= 0) {
    const dew = numOrNull(rec[col.dewpoint]);
    if (dew === undefined) return null;
    if (dew !== null) return null; // dew point conversion and its limits: the full path
  }
  let rain = col.rain < 0 ? null : numOrNull(rec[col.rain]);
  if (rain === undefined) return null;
  if (rain !== null) {
    if (ctx.rainUnit === 'in') rain = round2(toMillimetres(rain, 'in'));
    if (!(rain >= 0 && rain <= LIMITS.rainMaxMm)) return null;
  }
  if (!out) return { stationId: station.id, stationIndex: station.index ?? -1, date: dateText, day, tmin, tmax, rh, rain };
  out.stationId = station.id;
  out.stationIndex = station.index ?? -1;
  out.date = dateText;
  out.day = day;
  out.tmin = tmin;
  out.tmax = tmax;
  out.rh = rh;
  out.rain = rain;
  return out;
}

function fullCheck(rec: string[], col: ColumnIndex, rowNumber: number, ctx: RowContext, issues: RowIssue[]): CheckedRow | null {
  const code = rec[col.station]?.trim() ?? '';
  const dateText = rec[col.date]?.trim() ?? '';
  const start = issues.length;
  const reject = (column: string, value: string | null, rule: RejectRule, reason: string = REJECT_RULES[rule]) => {
    issues.push({ rowNumber, station: code || null, date: dateText || null, column, value, severity: 'rejected', rule, reason });
  };
  const station = ctx.stations.get(code);
  if (!station) reject('station', code, 'unknown-station');
  const day = dayOfIsoDate(dateText);
  if (Number.isNaN(day)) reject('date', dateText, dateProblem(dateText) === 'range' ? 'date-range' : 'bad-date');
  else if (day > ctx.lastDay) reject('date', dateText, 'future-date');
  else if (station && (day < station.activeFrom || day > station.activeTo)) reject('date', dateText, 'inactive-station');

  const num = (name: WeatherColumn, required: boolean): number | null => {
    const i = col[name];
    const raw = i < 0 ? '' : (rec[i] ?? '').trim();
    if (raw === '') {
      if (required) reject(name, raw, 'missing-value');
      return null;
    }
    if (plainNumber(raw) === undefined) {
      reject(name, raw, 'bad-number');
      return null;
    }
    return +raw;
  };
  const rawTmin = num('tmin', true);
  const rawTmax = num('tmax', true);
  const rawRh = num('rh', false);
  const rawDew = num('dewpoint', false);
  const rawRain = num('rain', false);

  const tmin = rawTmin === null ? null : ctx.tempUnit === 'F' ? round2(toCelsius(rawTmin, 'F')) : rawTmin;
  const tmax = rawTmax === null ? null : ctx.tempUnit === 'F' ? round2(toCelsius(rawTmax, 'F')) : rawTmax;
  const inTempLimits = (v: number) => v >= LIMITS.tempMinC && v <= LIMITS.tempMaxC;
  let tempsOk = tmin !== null && tmax !== null;
  if (tmin !== null && !inTempLimits(tmin)) {
    reject('tmin', rec[col.tmin].trim(), 'temp-limits');
    tempsOk = false;
  }
  if (tmax !== null && !inTempLimits(tmax)) {
    reject('tmax', rec[col.tmax].trim(), 'temp-limits');
    tempsOk = false;
  }
  if (tempsOk && tmin! > tmax!) reject('tmin', rec[col.tmin].trim(), 'tmin-above-tmax', `Tmin (${rec[col.tmin].trim()}) is above Tmax (${rec[col.tmax].trim()}).`);

  let rh: number | null = null;
  if (rawRh !== null) {
    if (rawRh < LIMITS.rhMin || rawRh > LIMITS.rhMax) reject('rh', rec[col.rh].trim(), 'rh-range');
    else rh = rawRh;
  } else if (rawDew !== null) {
    const dew = toCelsius(rawDew, ctx.tempUnit);
    if (!inTempLimits(dew) || (tmax !== null && dew > tmax + 0.05)) reject('dewpoint', rec[col.dewpoint].trim(), 'dewpoint-limits');
    else if (tempsOk) rh = Math.round(rhFromDewPoint(dew, (tmin! + tmax!) / 2) * 10) / 10;
  }
  let rain: number | null = null;
  if (rawRain !== null) {
    rain = ctx.rainUnit === 'in' ? round2(toMillimetres(rawRain, 'in')) : rawRain;
    if (rain < 0 || rain > LIMITS.rainMaxMm) reject('rain', rec[col.rain].trim(), 'rain-limits');
  }
  if (issues.length > start) return null;
  return { stationId: station!.id, stationIndex: station!.index ?? -1, date: dateText, day, tmin: tmin!, tmax: tmax!, rh, rain };
}

export interface DailyValue {
  day: number;
  tmin: number | null;
  tmax: number | null;
  rh: number | null;
  rain: number | null;
  stationCount: number;
}

export interface SeriesDay extends DailyValue {
  filled: boolean;
}

/**
 * A continuous daily series from the first to the last reported day. A gap of up to `maxFillDays`
 * days between two reported days is filled by linear interpolation (marked filled; rain is not
 * invented: a filled day has no rainfall value); a longer gap stays, each of its days with null values.
 */
export function fillGaps(reported: DailyValue[], maxFillDays: number): SeriesDay[] {
  const sorted = [...reported].sort((a, b) => a.day - b.day);
  const out: SeriesDay[] = [];
  for (let i = 0; i < sorted.length; i++) {
    const cur = sorted[i];
    if (i > 0) {
      const prev = sorted[i - 1];
      const gap = cur.day - prev.day - 1;
      for (let k = 1; k <= gap; k++) {
        const f = k / (gap + 1);
        const lerp = (a: number | null, b: number | null) =>
          a === null || b === null ? null : Math.round((a + (b - a) * f) * 100) / 100;
        if (gap <= maxFillDays)
          out.push({ day: prev.day + k, tmin: lerp(prev.tmin, cur.tmin), tmax: lerp(prev.tmax, cur.tmax), rh: lerp(prev.rh, cur.rh), rain: null, stationCount: 0, filled: true });
        else out.push({ day: prev.day + k, tmin: null, tmax: null, rh: null, rain: null, stationCount: 0, filled: false });
      }
    }
    out.push({ ...cur, filled: false });
  }
  return out;
}

/** Inverse-distance weights (power 2, Shepard 1968), normalised to sum 1; a station at distance 0 takes it all. */
export function idwWeights(distancesKm: number[], power = 2): number[] {
  const zero = distancesKm.findIndex((d) => d < 1e-6);
  if (zero >= 0) return distancesKm.map((_, i) => (i === zero ? 1 : 0));
  const raw = distancesKm.map((d) => 1 / d ** power);
  const sum = raw.reduce((a, b) => a + b, 0);
  return raw.map((w) => w / sum);
}

