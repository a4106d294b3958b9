import { once } from 'node:events';
import { finished } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { EntityManager } from 'typeorm';
import { BinaryCopyWriter, decodeArray } from '../db/pg-binary-copy';

/**
 * A station's year of daily values, as stored in weather_station_years: one element per day of the
 * calendar year (index 0 is 1 January), NaN where the station has no value. Stored so, one row per
 * station and year, because a national upload is 1.8 million station-days: written as 5,000 rows of
 * arrays it costs about what a plain COPY of the file costs, where 1.8 million keyed rows cost ten
 * times that (bench/intake.bench.ts; docs/weather-intake.md § Storage).
 */
export interface StationYear {
  stationId: string;
  year: number;
  /** Day number (days since 1970-01-01) of 1 January. */
  start: number;
  tmin: Float64Array;
  tmax: Float64Array;
  rh: Float64Array;
  rain: Float64Array;
  /** Quality flags of each day as bits (FLAG_BITS). */
  flags: Int16Array;
  /** The intake that wrote each day: 1-based into `uploads`, 0 for none. */
  uploadIx: Int16Array;
  uploads: string[];
}

/**
 * The flag rules as bits of StationYear.flags, in the order the row report lists them. `held`: the day was
 * judged implausible (docs/weather-intake.md § Plausibility) and is left out of the district series until
 * a person confirms or corrects it.
 */
export const FLAG_BITS = { jump: 1, run: 2, spatial: 4, held: 8 } as const;
export type FlagName = keyof typeof FLAG_BITS;
export const flagNames = (bits: number): FlagName[] =>
  (Object.keys(FLAG_BITS) as FlagName[]).filter((name) => (bits & FLAG_BITS[name]) !== 0);

export const yearStartDay = (year: number) => Date.UTC(year, 0, 1) / 86_400_000;
export const daysInYear = (year: number) => yearStartDay(year + 1) - yearStartDay(year);
export const stationYearKey = (stationId: string, year: number) => `${stationId}|${year}`;

export function emptyStationYear(stationId: string, year: number): StationYear {
  const n = daysInYear(year);
  return {
    stationId, year, start: yearStartDay(year),
    tmin: new Float64Array(n).fill(Number.NaN), tmax: new Float64Array(n).fill(Number.NaN),
    rh: new Float64Array(n).fill(Number.NaN), rain: new Float64Array(n).fill(Number.NaN),
    flags: new Int16Array(n), uploadIx: new Int16Array(n), uploads: [],
  };
}

/** The 1-based index of an upload in the year's list, added when new. */
export function uploadIndex(y: StationYear, uploadId: string): number {
  const at = y.uploads.indexOf(uploadId);
  if (at >= 0) return at + 1;
  y.uploads.push(uploadId);
  return y.uploads.length;
}

/** The stored years of these stations and years that exist, by stationYearKey. */
export async function readStationYears(manager: EntityManager, keys: { stationId: string; year: number }[]): Promise<Map<string, StationYear>> {
  const out = new Map<string, StationYear>();
  for (let i = 0; i < keys.length; i += 2000) {
    const part = keys.slice(i, i + 2000);
    const rows: { station_id: string; year: number; tmin: Buffer; tmax: Buffer; rh: Buffer; rain: Buffer; flags: Buffer; upload_ix: Buffer; uploads: Buffer }[] =
      await manager.query(
        `SELECT y.station_id, y.year, array_send(y.tmin) AS tmin, array_send(y.tmax) AS tmax, array_send(y.rh) AS rh, array_send(y.rain) AS rain,
                array_send(y.flags) AS flags, array_send(y.upload_ix) AS upload_ix, array_send(y.uploads) AS uploads
           FROM unnest($1::uuid[], $2::int[]) AS k(station_id, year)
           JOIN weather_station_years y ON y.station_id = k.station_id AND y.year = k.year`,
        [part.map((k) => k.stationId), part.map((k) => k.year)],
      );
    for (const r of rows) {
      const y = emptyStationYear(r.station_id, r.year);
      y.tmin.set(decodeArray(r.tmin).values as number[]);
      y.tmax.set(decodeArray(r.tmax).values as number[]);
      y.rh.set(decodeArray(r.rh).values as number[]);
      y.rain.set(decodeArray(r.rain).values as number[]);
      y.flags.set(decodeArray(r.flags).values as number[]);
      y.uploadIx.set(decodeArray(r.upload_ix).values as number[]);
      y.uploads = decodeArray(r.uploads).values as string[];
      out.set(stationYearKey(y.stationId, y.year), y);
    }
  }
  return out;
}

/** Drop uploads no day refers to any more, renumbering the days' indexes. */
function compactUploads(y: StationYear): void {
  const used = new Int16Array(y.uploads.length + 1);
  for (let i = 0; i < y.uploadIx.length; i++) used[y.uploadIx[i]] = 1;
  if (used.subarray(1).every((u) => u === 1)) return;
  const next: string[] = [];
  const remap = new Int16Array(y.uploads.length + 1);
  for (let k = 1; k < used.length; k++) if (used[k]) remap[k] = next.push(y.uploads[k - 1]);
  for (let i = 0; i < y.uploadIx.length; i++) y.uploadIx[i] = remap[y.uploadIx[i]];
  y.uploads = next;
}

const COPY_PART_BYTES = 8 << 20;

/** The transaction's own connection, for COPY. */
function transactionClient(manager: EntityManager): pg.PoolClient {
  const client = (manager.queryRunner as unknown as { databaseConnection?: pg.PoolClient } | undefined)?.databaseConnection;
  if (!client || !manager.queryRunner?.isTransactionActive) throw new Error('station years are written in an open transaction');
  return client;
}

/**
 * A binary COPY into weather_station_years on the transaction's connection, fed a year at a time and
 * sent in parts of 8 MB (so neither side holds the whole stream). Until `end()` resolves the connection
 * runs nothing else; `abort()` cancels the COPY (CopyFail) so the transaction can roll back.
 */
export function stationYearCopy(manager: EntityManager) {
  const copy = transactionClient(manager).query(copyFrom(
    'COPY weather_station_years (station_id, year, tmin, tmax, rh, rain, flags, upload_ix, uploads) FROM STDIN (FORMAT binary)',
  ));
  const done = finished(copy);
  done.catch(() => undefined);
  const w = new BinaryCopyWriter(COPY_PART_BYTES + (1 << 20));
  let ended = false;
  return {
    /** Queue one year; resolves at once unless the server is behind (then when it has caught up). */
    add(y: StationYear): Promise<void> | undefined {
      compactUploads(y);
      w.row(9).uuid(y.stationId).int4(y.year).float8Array(y.tmin).float8Array(y.tmax).float8Array(y.rh).float8Array(y.rain)
        .int2Array(y.flags).int2Array(y.uploadIx).uuidArray(y.uploads);
      // A failed COPY rejects `done`, which end() and abort() report; this promise only waits and never
      // rejects, so a caller that does not await it leaves no unobserved rejection behind.
      if (w.pending >= COPY_PART_BYTES && !copy.write(w.take())) return Promise.race([once(copy, 'drain'), done]).then(() => undefined, () => undefined);
      return undefined;
    },
    async end(): Promise<void> {
      ended = true;
      copy.end(w.finish());
      await done;
    },
    async abort(): Promise<void> {
      if (ended) return;
      ended = true;
      copy.destroy();
      await done.catch(() => undefined);
    },
  };
}

/** Store these years whole, in the caller's transaction: the stored rows of the same keys go, then one binary COPY writes them. */
export async function writeStationYears(manager: EntityManager, years: StationYear[]): Promise<void> {
  if (!years.length) return;
  for (let i = 0; i < years.length; i += 5000) {
    const part = years.slice(i, i + 5000);
    await manager.query(
      `DELETE FROM weather_station_years y USING unnest($1::uuid[], $2::int[]) AS k(station_id, year)
        WHERE y.station_id = k.station_id AND y.year = k.year`,
      [part.map((y) => y.stationId), part.map((y) => y.year)],
    );
  }
  const copy = stationYearCopy(manager);
  try {
    for (const y of years) await copy.add(y);
  } catch (err) {
    await copy.abort();
    throw err;
  }
  await copy.end();
}

/** Set the flags of stored years (the rest of each row stays as it is). */
export async function writeStationYearFlags(manager: EntityManager, years: StationYear[]): Promise<void> {
  for (let i = 0; i < years.length; i += 2000) {
    const part = years.slice(i, i + 2000);
    await manager.query(
      `UPDATE weather_station_years y SET flags = v.flags::smallint[], updated_at = now()
         FROM unnest($1::uuid[], $2::int[], $3::text[]) AS v(station_id, year, flags)
        WHERE y.station_id = v.station_id AND y.year = v.year`,
      [part.map((y) => y.stationId), part.map((y) => y.year), part.map((y) => `{${y.flags.join(',')}}`)],
    );
  }
}

/** Which station-years are stored (keys by stationYearKey). */
export async function storedStationYearKeys(manager: EntityManager): Promise<Set<string>> {
  const rows: { station_id: string; year: number }[] = await manager.query('SELECT station_id, year FROM weather_station_years');
  return new Set(rows.map((r) => stationYearKey(r.station_id, r.year)));
}
