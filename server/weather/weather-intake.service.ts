import { unlink } from 'node:fs/promises';
import type { EntityManager } from 'typeorm';
import {
  checkRow, type RainUnit, readHeader, type RowContext, type RowIssue, type StationRef, type TempUnit,
} from '../../shared/weather/qc';
import { LIMITS } from '../../shared/limits';
import type { AppContext } from '../app-context';
import { capText } from '../http/limits';
import { recordAudit } from '../audit/audit.repository';
import { recomputeSeriesSpans, SERIES_EVER, spansForStationDays } from './district-series.repository';
import {
  emptyStationYear, FLAG_BITS, flagNames, readStationYears, type StationYear, stationYearCopy, stationYearKey, storedStationYearKeys, uploadIndex,
  writeStationYearFlags, writeStationYears,
} from './station-years.repository';
import { type FlagFinding, flagStationYears } from './weather-flags';
import { type HeldRow, judgePlausibility } from './weather-plausibility';
import { neighbours, refreshAssignments } from './weather-geo';
import { type UploadSource, WeatherUploadEntity } from './weather-upload.entity';
import { type CheckedBatch, type ReaderOptions, readChecked } from './intake-reader';
import { csvFileSource, IntakeFailure, type IntakeSource, NOTHING_KEPT } from './intake-source';

export { csvFileSource, csvStreamSource, IntakeFailure, type IntakeSource, recordsSource } from './intake-source';

export interface IntakeStart {
  source: UploadSource;
  fileName: string | null;
  tempUnit: TempUnit;
  rainUnit: RainUnit;
  bytesTotal: number;
  actorId: string | null;
}

/** Every station by code, with its active days, as the row checks read them. */
async function stationRefs(manager: EntityManager): Promise<Map<string, StationRef>> {
  const rows: { id: string; code: string; af: number | null; at: number | null }[] = await manager.query(
    `SELECT id, code, active_from - DATE '1970-01-01' AS af, active_to - DATE '1970-01-01' AS at FROM weather_stations`,
  );
  return new Map(rows.map((s) => [s.code, { id: s.id, activeFrom: s.af ?? -Infinity, activeTo: s.at ?? Infinity }]));
}

/**
 * The one intake pipeline behind uploads, the feed and corrections. Rows stream through the checks into
 * a temporary staging table with COPY; then, in the same transaction: duplicates out, replaced values
 * into the revisions, the merge keyed by (station, date), the flag rules, district assignment and the
 * district series, the report, the final status. A failure rolls all of it back.
 */
export class WeatherIntakeService {
  constructor(private readonly ctx: AppContext) {}

  async start(opts: IntakeStart): Promise<WeatherUploadEntity> {
    const repo = this.ctx.ds.getRepository(WeatherUploadEntity);
    return repo.save(repo.create({
      source: opts.source, fileName: opts.fileName, status: 'processing', tempUnit: opts.tempUnit, rainUnit: opts.rainUnit,
      bytesTotal: String(opts.bytesTotal), createdBy: opts.actorId,
    }));
  }

  /**
   * The row checks alone, on rows already in memory, writing nothing: what a one-day correction is
   * refused for before any upload is recorded. The same checks as the intake's (shared/weather/qc.ts).
   */
  async rowIssues(header: string[], rows: string[][], units: { tempUnit: TempUnit; rainUnit: RainUnit }): Promise<RowIssue[]> {
    const col = readHeader(header);
    if ('problem' in col) throw new IntakeFailure('bad_header', col.problem);
    const ctx: RowContext = { stations: await stationRefs(this.ctx.ds.manager), ...units, lastDay: Math.floor(Date.now() / 86_400_000) };
    const issues: RowIssue[] = [];
    rows.forEach((rec, i) => checkRow(rec, col.index, i + 2, ctx, issues));
    return issues;
  }

  /** Check and load a file written by multer, then delete it. Never throws: the upload row tells the outcome. */
  async runFile(upload: WeatherUploadEntity, path: string, onHeader?: () => void): Promise<void> {
    try {
      await this.run(upload, csvFileSource(path), onHeader);
    } finally {
      await unlink(path).catch(() => undefined);
    }
  }

  /**
   * Run an intake to its end; the upload row says done, refused (and why) or failed. Never throws.
   * `onHeader` is called once the file's header is read and accepted: from then on the file is not
   * refused as a whole for its form (only for a later line past the limit, a cut-off end or bad CSV).
   */
  async run(upload: WeatherUploadEntity, source: IntakeSource, onHeader?: () => void): Promise<void> {
    if (onHeader) source = afterHeader(source, onHeader);
    const { ds, config, logger } = this.ctx;
    const progress = { rows: 0, bytes: 0 };
    let beatInFlight: Promise<unknown> = Promise.resolve();
    const beat = () => {
      beatInFlight = ds
        .query(`UPDATE weather_uploads SET heartbeat_at = now(), rows_processed = $2, bytes_processed = $3 WHERE id = $1 AND status = 'processing'`,
          [upload.id, progress.rows, progress.bytes])
        .catch(() => undefined);
    };
    const timer = setInterval(beat, config.WEATHER_HEARTBEAT_MS);
    const stopBeat = async () => {
      clearInterval(timer);
      await beatInFlight;
    };
    const qr = ds.createQueryRunner();
    try {
      await qr.connect();
      await qr.startTransaction();
      const result = await this.load(qr.manager, upload, source, progress);
      await stopBeat();
      await qr.query(
        `UPDATE weather_uploads SET status = 'done', rows_processed = $2, rows_accepted = $3, rows_flagged = $4, rows_rejected = $5,
                rows_replaced = $6, rows_held = $8, rows_conflicting = $9, bytes_processed = bytes_total, message = $7, heartbeat_at = now(),
                finished_at = clock_timestamp() WHERE id = $1`,
        [upload.id, result.processed, result.accepted, result.flagged, result.rejected, result.replaced, result.message, result.held, result.conflicting],
      );
      await recordAudit(qr.manager, {
        actorId: upload.createdBy, action: 'weather.intake-loaded', entity: 'weather_upload', entityId: upload.id,
        after: { source: upload.source, fileName: upload.fileName, ...result },
      });
      await qr.commitTransaction();
    } catch (raw) {
      await stopBeat();
      if (qr.isTransactionActive) await qr.rollbackTransaction().catch(() => undefined);
      const err = raw as Error;
      // A file that cannot be loaded is refused with its reason (a code the client words, and its
      // parameters); any other error is the server's fault: logged, and the upload says only that.
      const refused = err instanceof IntakeFailure;
      if (!refused) logger.error({ err, uploadId: upload.id }, 'weather intake failed');
      const message = refused ? capText(err.message) : `The data could not be loaded because of a fault on the server (it is logged). ${NOTHING_KEPT}`;
      await ds.query(
        `UPDATE weather_uploads SET status = $4, message = $2, reason_code = $5, reason_params = $6, rows_processed = $3, rows_accepted = 0,
                rows_flagged = 0, rows_replaced = 0, finished_at = clock_timestamp() WHERE id = $1 AND status = 'processing'`,
        [upload.id, message, progress.rows, refused ? 'refused' : 'failed', refused ? err.code : 'intake_error', refused ? err.params : {}],
      ).catch((e) => logger.error({ err: e }, 'could not mark the upload failed'));
    } finally {
      await qr.release();
    }
  }

  private async load(manager: EntityManager, upload: WeatherUploadEntity, source: IntakeSource, progress: { rows: number; bytes: number }) {
    const { config } = this.ctx;
    let mark = performance.now();
    const stages: Record<string, number> = {};
    const stage = (name: string) => {
      const now = performance.now();
      stages[name] = Math.round(now - mark);
      mark = now;
    };
    const stations = await stationRefs(manager);
    const list = [...stations.entries()];
    const ids = list.map(([, ref]) => ref.id);
    const codes = list.map(([code]) => code);
    const readerOptions: ReaderOptions = {
      stations: { codes, activeFrom: list.map(([, r]) => r.activeFrom), activeTo: list.map(([, r]) => r.activeTo) },
      tempUnit: upload.tempUnit, rainUnit: upload.rainUnit, lastDay: Math.floor(Date.now() / 86_400_000),
      maxIssues: config.WEATHER_REPORT_MAX_ISSUES,
    };

    const issues: RowIssue[] = [];
    const maxIssues = config.WEATHER_REPORT_MAX_ISSUES;
    let issuesDropped = 0;
    let rejected = 0;
    let accepted = 0;
    const note = (issue: RowIssue) => {
      if (issues.length < maxIssues) issues.push(issue);
      else issuesDropped++;
    };

    // One intake at a time: each reads the stored years it changes and writes them whole.
    await manager.query("SELECT pg_advisory_xact_lock(hashtext('broodcast.weather-intake'))");
    const storedKeys = await storedStationYearKeys(manager);
    const positions: { id: string; latitude: number; longitude: number; elevation: number | null }[] = await manager.query(
      'SELECT id, latitude, longitude, elevation FROM weather_stations',
    );

    // The accepted rows, by station and year, stay in memory until the end of the file (the flag rules
    // read them): a station-year is about 13 kB whatever the file's size, so a national year holds about
    // 65 MB. A year not stored before is written as soon as the file moves on to another (the usual
    // file is one station after another), so the database writes while the rest of the file is read.
    const incoming = new Map<string, Incoming>();
    let cur: Incoming | null = null;
    let early: ReturnType<typeof stationYearCopy> | null = null;
    const written = new Set<Incoming>();
    const dirty = new Set<Incoming>();
    const writeEarly = (inc: Incoming) => {
      if (written.has(inc) || storedKeys.has(stationYearKey(inc.y.stationId, inc.y.year))) return;
      early ??= stationYearCopy(manager);
      void early.add(adopt(inc, upload.id));
      written.add(inc);
    };
    // Each batch of checked rows into its station-year; a station and date met twice keeps the first.
    const onBatch = (b: CheckedBatch) => {
      progress.rows = b.rowsRead;
      progress.bytes = b.bytesRead;
      rejected += b.rejected;
      issuesDropped += b.issuesDropped;
      for (const i of b.issues) note(i);
      for (let k = 0; k < b.n; k++) {
        const day = b.day[k];
        const st = b.station[k];
        if (!cur || cur.stationIndex !== st || day < cur.y.start || day >= cur.y.start + cur.row.length) {
          if (cur) writeEarly(cur);
          const year = new Date(day * 86_400_000).getUTCFullYear();
          const key = stationYearKey(ids[st], year);
          cur = incoming.get(key) ?? null;
          if (!cur) incoming.set(key, (cur = newIncoming(ids[st], st, year)));
          else if (written.has(cur)) dirty.add(cur);
        }
        const i = day - cur.y.start;
        const first = cur.row[i];
        if (first !== 0) {
          rejected++;
          note({ rowNumber: b.row[k], station: codes[st], date: iso(day), column: '(row)', value: null, severity: 'rejected',
            rule: 'duplicate-row', reason: `The same station and date are on row ${first}; that first row was kept.`, params: { first } });
          continue;
        }
        accepted++;
        cur.row[i] = b.row[k];
        cur.y.tmin[i] = b.tmin[k];
        cur.y.tmax[i] = b.tmax[k];
        cur.y.rh[i] = b.rh[k];
        cur.y.rain[i] = b.rain[k];
      }
    };
    let processed: number;
    try {
      processed = await readChecked(source, readerOptions, onBatch);
    } catch (err) {
      await (early as ReturnType<typeof stationYearCopy> | null)?.abort();
      throw err;
    }
    progress.rows = processed;
    stage('read');
    // The database finishes the COPY while this thread finds the neighbours (and, when nothing stored
    // is needed, runs the merge and the flag rules); the connection is free again once it resolves.
    const copied = (early as ReturnType<typeof stationYearCopy> | null)?.end() ?? Promise.resolve();
    copied.catch(() => undefined); // awaited below

    const seenStations = new Set([...incoming.values()].map((inc) => inc.y.stationId));
    const nb = neighbours(positions, config.WEATHER_QC_NEIGHBOUR_KM).filter((n) => seenStations.has(n.stationId));
    // The stored years to read: those this intake changes, the years either side (the day before 1 January,
    // runs across the new year) and the neighbours' same years (the spatial rule).
    const wanted = new Map<string, { stationId: string; year: number }>();
    const want = (stationId: string, year: number) => {
      const key = stationYearKey(stationId, year);
      if (storedKeys.has(key)) wanted.set(key, { stationId, year });
    };
    const yearsOf = new Map<string, number[]>();
    for (const { y } of incoming.values()) {
      for (const yr of [y.year - 1, y.year, y.year + 1]) want(y.stationId, yr);
      yearsOf.set(y.stationId, [...(yearsOf.get(y.stationId) ?? []), y.year]);
    }
    for (const n of nb) for (const yr of yearsOf.get(n.stationId) ?? []) want(n.neighbourId, yr);
    if (wanted.size) await copied;
    const years = await readStationYears(manager, [...wanted.values()]);
    stage('stored');

    // Hand corrections win (issue 16): a feed pull or an upload never replaces a day whose stored value a
    // person corrected (its intake is a correction); the new value is kept as an open conflict instead.
    const hand = new Set<string>();
    if (upload.source !== 'correction') {
      const ids = new Set<string>();
      for (const inc of incoming.values()) for (const u of years.get(stationYearKey(inc.y.stationId, inc.y.year))?.uploads ?? []) ids.add(u);
      if (ids.size) {
        const rows: { id: string }[] = await manager.query(
          `SELECT id FROM weather_uploads WHERE id = ANY($1::uuid[]) AND source = 'correction'`, [[...ids]],
        );
        for (const r of rows) hand.add(r.id);
      }
    }
    const conflicts: Conflict[] = [];

    // The merge, keyed by station and date: a new value replaces the stored one (which goes to the
    // revisions); the same value changes nothing; days the intake does not carry stay as they were.
    const revisions: Revision[] = [];
    const rewrite = new Set<StationYear>();
    // unchanged[i] = 1: the intake brings the values already stored, so a day's held state stays as it is
    // (a day a person confirmed is not held again by the next pull of the same values).
    const merged: { y: StationYear; rows: Int32Array; unchanged?: Uint8Array }[] = [];
    // The station-days whose value or held state this intake changes (first and last day per station): only
    // the district series days they feed are recomputed (issue 17), so an unchanged re-upload recomputes nothing.
    const changedDays = new Map<string, { first: number; last: number }>();
    const changedDay = (stationId: string, day: number) => {
      const had = changedDays.get(stationId);
      if (!had) changedDays.set(stationId, { first: day, last: day });
      else if (day < had.first) had.first = day;
      else if (day > had.last) had.last = day;
    };
    for (const inc of incoming.values()) {
      const key = stationYearKey(inc.y.stationId, inc.y.year);
      const stored = years.get(key);
      if (!stored) {
        const y = adopt(inc, upload.id);
        years.set(key, y);
        if (!written.has(inc) || dirty.has(inc)) rewrite.add(y);
        for (let i = 0; i < inc.row.length; i++) if (inc.row[i] !== 0) changedDay(y.stationId, y.start + i);
        merged.push({ y, rows: inc.row });
        continue;
      }
      const y = stored;
      const unchanged = new Uint8Array(inc.row.length);
      let ix = 0;
      for (let i = 0; i < inc.row.length; i++) {
        if (inc.row[i] === 0) continue;
        const had = y.tmin[i] === y.tmin[i];
        const v = inc.y;
        if (had && same(y.tmin[i], v.tmin[i]) && same(y.tmax[i], v.tmax[i]) && same(y.rh[i], v.rh[i]) && same(y.rain[i], v.rain[i])) {
          unchanged[i] = 1;
          continue;
        }
        if (had && y.uploadIx[i] && hand.has(y.uploads[y.uploadIx[i] - 1])) {
          conflicts.push({ stationId: y.stationId, day: y.start + i, tmin: v.tmin[i], tmax: v.tmax[i], rh: nullable(v.rh[i]), rain: nullable(v.rain[i]) });
          inc.row[i] = 0; // not this intake's day: no flags, no plausibility, no report line
          continue;
        }
        if (had)
          revisions.push({
            stationId: y.stationId, day: y.start + i, tmin: y.tmin[i], tmax: y.tmax[i], rh: nullable(y.rh[i]), rain: nullable(y.rain[i]),
            flags: flagNames(y.flags[i]), previousUploadId: y.uploadIx[i] ? y.uploads[y.uploadIx[i] - 1] : null,
          });
        if (!ix) ix = uploadIndex(y, upload.id);
        y.tmin[i] = v.tmin[i];
        y.tmax[i] = v.tmax[i];
        y.rh[i] = v.rh[i];
        y.rain[i] = v.rain[i];
        y.uploadIx[i] = ix;
        rewrite.add(y);
        changedDay(y.stationId, y.start + i);
      }
      merged.push({ y, rows: inc.row, unchanged });
    }
    stage('merge');

    // Plausibility (docs/weather-intake.md § Plausibility): implausible days are held. A correction is a
    // person's own value and is not held (correcting a held day releases it).
    // It reads stored history on this connection, so the early COPY must have ended.
    if (upload.source !== 'correction') await copied;
    const plaus = upload.source === 'correction'
      ? { held: merged.map(() => null), rows: [] as HeldRow[] }
      : await judgePlausibility(manager, merged, years, nb, storedKeys, { tempUnit: upload.tempUnit, historyYears: config.WEATHER_PLAUS_HISTORY_YEARS });
    stage('plausibility');
    // Each intake day's held state after this intake: an unchanged day keeps its own, the others take the verdict.
    const heldNow = merged.map(({ y, rows, unchanged }, k) => {
      const out = new Uint8Array(rows.length);
      const heldDays = plaus.held[k];
      for (let i = 0; i < rows.length; i++)
        if (rows[i] !== 0) out[i] = unchanged?.[i] ? (y.flags[i] & FLAG_BITS.held ? 1 : 0) : heldDays?.[i] ? 1 : 0;
      return out;
    });

    // The flag rules (docs/weather-intake.md § Flag) on this intake's days, against the merged values in use
    // (after the plausibility verdict, so a day after a held day is compared with the last value in use).
    const { bits: newBits, findings } = flagStationYears(merged, years, nb, {
      runDays: config.WEATHER_QC_RUN_DAYS, jumpC: config.WEATHER_QC_JUMP_C, spatialC: config.WEATHER_QC_SPATIAL_C,
    }, heldNow);
    stage('flags');

    const reflag = new Set<StationYear>();
    for (let k = 0; k < merged.length; k++) {
      const { y, rows } = merged[k];
      for (let i = 0; i < rows.length; i++) {
        if (rows[i] === 0) continue;
        const held = heldNow[k][i] ? FLAG_BITS.held : 0;
        const bits = newBits[k][i] | held;
        if (bits !== y.flags[i]) {
          if ((bits ^ y.flags[i]) & FLAG_BITS.held) changedDay(y.stationId, y.start + i);
          y.flags[i] = bits;
          if (!rewrite.has(y)) reflag.add(y);
        }
      }
    }
    stage('reflag');

    await copied;
    await writeStationYears(manager, [...rewrite]);
    await writeStationYearFlags(manager, [...reflag]);
    await insertRevisions(manager, revisions, upload.id, upload.createdBy);
    await insertConflicts(manager, conflicts, upload.id);
    stage('write');

    // Districts whose sources changed get their whole series again; the others only the changed days. An
    // intake moves no station and no boundary, so the stations stay where they are placed.
    const touched = await refreshAssignments(manager, config.WEATHER_IDW_STATIONS, config.WEATHER_IDW_MAX_KM, { placeStations: false });
    stage('assignments');
    await recomputeSeriesSpans(manager, [
      ...[...touched].map((districtId) => ({ districtId, from: SERIES_EVER.from, to: SERIES_EVER.to })),
      ...(await spansForStationDays(manager, changedDays)),
    ], config.WEATHER_FILL_MAX_DAYS);
    stage('series');

    const codeOf = new Map(ids.map((id, k) => [id, codes[k]]));
    const heldLines = heldIssues(plaus.rows, codeOf, maxIssues - issues.length);
    const flagged = flagIssues(findings, codeOf, config, maxIssues - issues.length - heldLines.issues.length);
    await insertIssues(manager, upload.id, [...issues, ...heldLines.issues, ...flagged.issues]);
    const listed = issues.length + heldLines.issues.length + flagged.issues.length;
    const more = issuesDropped + heldLines.dropped + flagged.dropped;
    const message = more > 0 ? `The report lists the first ${listed.toLocaleString('en')} findings; ${more.toLocaleString('en')} more were not listed.` : null;
    stage('issues');
    this.ctx.logger.info({ uploadId: upload.id, stagesMs: stages }, 'weather intake stages');
    return {
      processed, accepted: accepted - conflicts.length, flagged: findings.length, rejected, replaced: revisions.length, message,
      held: plaus.rows.length, conflicting: conflicts.length,
    };
  }

  /** Mark failed every upload whose process stopped touching it (a crash or a kill mid-load). */
  async sweepStale(): Promise<number> {
    const rows = await this.ctx.ds.query(
      `UPDATE weather_uploads SET status = 'failed', reason_code = 'server_stopped', finished_at = now(),
              message = 'The server stopped while checking this file, so nothing from it was saved. Upload it again.'
        WHERE status = 'processing' AND heartbeat_at < now() - make_interval(secs => $1) RETURNING id`,
      [this.ctx.config.WEATHER_UPLOAD_STALE_SECONDS],
    );
    return (rows[0] as unknown[] | undefined)?.length ?? 0;
  }
}

/** The source, calling `then` once its first record (the header) has been taken without an error. */
function afterHeader(source: IntakeSource, then: () => void): IntakeSource {
  let seen = false;
  return {
    ...source,
    read: (each) => source.read((rec) => {
      each(rec);
      if (!seen) {
        seen = true;
        then();
      }
    }),
  };
}

const short = (text: string | null) => capText(text, LIMITS.VALUE_MAX_CHARS);

async function insertIssues(manager: EntityManager, uploadId: string, issues: RowIssue[]) {
  for (let i = 0; i < issues.length; i += 5000) {
    const part = issues.slice(i, i + 5000);
    await manager.query(
      `INSERT INTO weather_upload_issues (upload_id, row_number, station, date, "column", value, severity, rule, reason, params)
       SELECT $1, r, st, d, c, v, sev, ru, re, p::jsonb
         FROM unnest($2::int[], $3::text[], $4::text[], $5::text[], $6::text[], $7::text[], $8::text[], $9::text[], $10::text[])
              AS x(r, st, d, c, v, sev, ru, re, p)`,
      // Every stored text capped (LIMITS.VALUE_MAX_CHARS, MESSAGE_MAX_CHARS), marked with what was cut.
      [uploadId, part.map((x) => x.rowNumber), part.map((x) => short(x.station)), part.map((x) => short(x.date)), part.map((x) => short(x.column)),
        part.map((x) => short(x.value)), part.map((x) => x.severity), part.map((x) => short(x.rule)), part.map((x) => capText(x.reason)),
        part.map((x) => (x.params ? JSON.stringify(x.params) : null))],
    );
  }
}

/**
 * A station-year of accepted rows as the file gives them: the values in `y` (a year not stored before is
 * stored as it is), row[i] the file's row number of day i (0: none).
 */
interface Incoming {
  stationIndex: number;
  row: Int32Array;
  y: StationYear;
}

const newIncoming = (stationId: string, stationIndex: number, year: number): Incoming => {
  const y = emptyStationYear(stationId, year);
  return { stationIndex, row: new Int32Array(y.tmin.length), y };
};

/** The incoming year as written by this upload alone (nothing stored for it before): its days point at the upload. */
function adopt(inc: Incoming, uploadId: string): StationYear {
  const { y, row } = inc;
  for (let i = 0; i < row.length; i++) y.uploadIx[i] = row[i] !== 0 ? 1 : 0;
  y.uploads = [uploadId];
  return y;
}

/** Equal values, a missing value (NaN) equal only to a missing one: SQL's IS NOT DISTINCT FROM. */
const same = (a: number, b: number) => a === b || (a !== a && b !== b);
const nullable = (x: number) => (x === x ? x : null);
const iso = (day: number) => new Date(day * 86_400_000).toISOString().slice(0, 10);

interface Revision {
  stationId: string;
  day: number;
  tmin: number;
  tmax: number;
  rh: number | null;
  rain: number | null;
  flags: string[];
  previousUploadId: string | null;
}

/** The values this intake replaced, into the audit trail of observations. */
async function insertRevisions(manager: EntityManager, revisions: Revision[], uploadId: string, actorId: string | null) {
  for (let i = 0; i < revisions.length; i += 5000) {
    const part = revisions.slice(i, i + 5000);
    await manager.query(
      `INSERT INTO weather_observation_revisions (station_id, date, tmin, tmax, rh, rain, flags, previous_upload_id, replaced_by_upload_id, replaced_by)
       SELECT v.station_id, v.date, v.tmin, v.tmax, v.rh, v.rain,
              coalesce((SELECT array_agg(f) FROM unnest(string_to_array(nullif(v.flags, ''), ',')) f), '{}'), v.previous, $9, $10
         FROM unnest($1::uuid[], $2::date[], $3::float8[], $4::float8[], $5::float8[], $6::float8[], $7::text[], $8::uuid[])
              AS v(station_id, date, tmin, tmax, rh, rain, flags, previous)`,
      [part.map((r) => r.stationId), part.map((r) => iso(r.day)), part.map((r) => r.tmin), part.map((r) => r.tmax), part.map((r) => r.rh),
        part.map((r) => r.rain), part.map((r) => r.flags.join(',')), part.map((r) => r.previousUploadId), uploadId, actorId],
    );
  }
}

interface Conflict {
  stationId: string;
  day: number;
  tmin: number;
  tmax: number;
  rh: number | null;
  rain: number | null;
}

/** Values kept back because the day was corrected by hand: one open conflict per station-day (a newer value replaces the older). */
async function insertConflicts(manager: EntityManager, conflicts: Conflict[], uploadId: string) {
  for (let i = 0; i < conflicts.length; i += 5000) {
    const part = conflicts.slice(i, i + 5000);
    await manager.query(
      `INSERT INTO weather_observation_conflicts (station_id, date, tmin, tmax, rh, rain, upload_id)
       SELECT v.*, $7::uuid FROM unnest($1::uuid[], $2::date[], $3::float8[], $4::float8[], $5::float8[], $6::float8[]) AS v
       ON CONFLICT (station_id, date) WHERE resolved_at IS NULL
       DO UPDATE SET tmin = excluded.tmin, tmax = excluded.tmax, rh = excluded.rh, rain = excluded.rain, upload_id = excluded.upload_id,
                     created_at = now()`,
      [part.map((c) => c.stationId), part.map((c) => iso(c.day)), part.map((c) => c.tmin), part.map((c) => c.tmax), part.map((c) => c.rh),
        part.map((c) => c.rain), uploadId],
    );
  }
}

/**
 * The row report's lines for the held days: one per implausible value, with the reason as its rule code and
 * the figures as params (the client words them); the English sentence is for the CSV and the log.
 */
function heldIssues(rows: HeldRow[], codeOf: Map<string, string>, room: number) {
  const sorted = [...rows].sort((a, b) => a.rowNumber - b.rowNumber);
  const issues: RowIssue[] = [];
  let dropped = 0;
  for (const r of sorted) {
    for (const f of r.findings) {
      if (issues.length >= Math.max(0, room)) {
        dropped++;
        continue;
      }
      const unit = f.column === 'rh' ? '%' : '°C';
      const reading = f.alternative !== null ? ` Read as °${r.reason === 'looks_fahrenheit' ? 'F' : 'C'} it would be ${f.alternative} °C, which fits.` : '';
      issues.push({
        rowNumber: r.rowNumber, station: codeOf.get(r.stationId) ?? null, date: iso(r.day), column: f.column, value: String(f.value),
        severity: 'held', rule: r.reason,
        reason: `Held: ${f.value} ${unit} is far from the ${f.basis === 'station' ? "station's own values" : "neighbouring stations' values"} for this time of year `
          + `(median ${f.median} ${unit}, modified z-score ${f.z}, limit 3.5).${reading} Confirm it or correct it.`,
        params: { column: f.column, value: f.value, median: f.median, mad: f.mad, z: f.z, n: f.n, basis: f.basis, alternative: f.alternative },
      });
    }
  }
  return { issues, dropped };
}

/** The row report's lines for the flagged days, in row order, at most `room` of them. */
function flagIssues(findings: FlagFinding[], codeOf: Map<string, string>, config: AppContext['config'], room: number) {
  const sorted = [...findings].sort((a, b) => a.rowNumber - b.rowNumber);
  const issues: RowIssue[] = [];
  let dropped = 0;
  const take = Math.max(0, room);
  for (const f of sorted) {
    const base = { rowNumber: f.rowNumber, station: codeOf.get(f.stationId) ?? null, date: iso(f.day), column: 'tmax', value: String(f.tmax), severity: 'flagged' as const };
    const lines: RowIssue[] = [];
    if (f.jump)
      lines.push({ ...base, rule: 'jump', reason: `Tmin ${f.ptmin} → ${f.tmin}, Tmax ${f.ptmax} → ${f.tmax} °C from the day before (limit ${config.WEATHER_QC_JUMP_C} °C).`,
        params: { ptmin: f.ptmin, tmin: f.tmin, ptmax: f.ptmax, tmax: f.tmax, limit: config.WEATHER_QC_JUMP_C } });
    if (f.run)
      lines.push({ ...base, rule: 'run', reason: `Tmin ${f.tmin} and Tmax ${f.tmax} °C repeated on ${f.runLength} days in a row (limit ${config.WEATHER_QC_RUN_DAYS}).`,
        params: { tmin: f.tmin, tmax: f.tmax, days: f.runLength, limit: config.WEATHER_QC_RUN_DAYS } });
    if (f.spatial)
      lines.push({ ...base, rule: 'spatial', reason: `Tmin ${f.tmin} / Tmax ${f.tmax} °C against ${f.etmin!.toFixed(1)} / ${f.etmax!.toFixed(1)} °C estimated from the neighbouring stations (limit ${config.WEATHER_QC_SPATIAL_C} °C).`,
        params: { tmin: f.tmin, tmax: f.tmax, etmin: Math.round(f.etmin! * 10) / 10, etmax: Math.round(f.etmax! * 10) / 10, limit: config.WEATHER_QC_SPATIAL_C } });
    for (const line of lines) {
      if (issues.length < take) issues.push(line);
      else dropped++;
    }
  }
  return { issues, dropped };
}
