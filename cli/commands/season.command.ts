import { z } from 'zod';
import type { CliCommand } from '../command';
import { getProfile, PROFILE_IDS } from '../../shared/model/profiles';
import { computeSeason, type SeasonInputDay } from '../../shared/model/season';
import { isCalendarDate } from '../../shared/api/date.schema';
import { CliError } from './cli-error';
import { isoDate, latitude, oneOf } from './options';

const input = z.strictObject({
  profile: oneOf(PROFILE_IDS as [string, ...string[]]),
  lat: latitude(),
  biofix: isoDate().optional(),
});

const NUMBER = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

function cell(value: string | undefined, name: string, line: number, lo: number, hi: number): number | null {
  const t = (value ?? '').trim();
  if (t === '') return null;
  if (!NUMBER.test(t)) throw new CliError(`stdin line ${line}: ${name}: expected a number, got ${JSON.stringify(t)}`);
  const x = Number(t);
  if (x < lo || x > hi) throw new CliError(`stdin line ${line}: ${name}: ${x} is outside ${lo}…${hi}`);
  return x;
}

/** Parse the `date,tmin,tmax,rh` CSV (header line; columns found by name; rh and an optional `filled` column may be empty). */
export async function readWeatherCsv(lines: AsyncIterable<string>): Promise<SeasonInputDay[]> {
  let header: string[] | null = null;
  let n = 0;
  const days: SeasonInputDay[] = [];
  let col = { date: -1, tmin: -1, tmax: -1, rh: -1, filled: -1 };
  for await (const raw of lines) {
    n++;
    const line = raw.replace(/\r$/, '');
    if (line.trim() === '') continue;
    const cells = line.split(',');
    if (header === null) {
      header = cells.map((c) => c.trim().toLowerCase());
      col = { date: header.indexOf('date'), tmin: header.indexOf('tmin'), tmax: header.indexOf('tmax'), rh: header.indexOf('rh'), filled: header.indexOf('filled') };
      for (const k of ['date', 'tmin', 'tmax'] as const) if (col[k] < 0) throw new CliError(`stdin line 1: the header has no "${k}" column (expected date,tmin,tmax,rh)`);
      continue;
    }
    const date = (cells[col.date] ?? '').trim();
    if (!isCalendarDate(date)) throw new CliError(`stdin line ${n}: date: expected a date YYYY-MM-DD from 1900 to 2100, got ${JSON.stringify(date)}`);
    const tmin = cell(cells[col.tmin], 'tmin', n, -90, 60);
    const tmax = cell(cells[col.tmax], 'tmax', n, -90, 60);
    if (tmin !== null && tmax !== null && tmin > tmax) throw new CliError(`stdin line ${n}: tmin: ${tmin} is above tmax ${tmax}`);
    const rh = col.rh >= 0 ? cell(cells[col.rh], 'rh', n, 0, 100) : null;
    const f = col.filled >= 0 ? (cells[col.filled] ?? '').trim().toLowerCase() : '';
    days.push({ date, tmin, tmax, rh, filled: f === 'true' || f === '1' });
  }
  if (header === null) throw new CliError('stdin: no CSV header (expected date,tmin,tmax,rh)');
  return days;
}

export const seasonCommand: CliCommand<z.infer<typeof input>> = {
  name: 'season',
  summary: 'Season computation (vector clock per day) from CSV date,tmin,tmax,rh on stdin; one JSON object per day.',
  input,
  stream: async function* (v, lines) {
    const days = await readWeatherCsv(lines);
    let result;
    try {
      result = computeSeason(getProfile(v.profile), { lat: v.lat, biofix: v.biofix }, days);
    } catch (e) {
      if (e instanceof RangeError) throw new CliError(`stdin: ${e.message}`);
      throw e;
    }
    yield* result;
  },
};
