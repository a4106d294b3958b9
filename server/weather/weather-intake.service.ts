import { once } from 'node:events';
import { createReadStream } from 'node:fs';
import { unlink } from 'node:fs/promises';
import { pipeline, Transform } from 'node:stream';
import { finished } from 'node:stream/promises';
import { CsvError, parse } from 'csv-parse';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { EntityManager } from 'typeorm';
import {
  type CheckedRow, checkRow, FLAG_RULES, type RainUnit, readHeader, REJECT_RULES, type RowContext, type RowIssue, type StationRef, type TempUnit,
} from '../../shared/weather/qc';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { districtsUsingStations, recomputeDistrictSeries } from './district-series.repository';
import { neighbours, refreshAssignments } from './weather-geo';
import { type UploadSource, WeatherUploadEntity } from './weather-upload.entity';

/** A failure that ends an intake with a message for the person who sent it; nothing from it is kept. */
export class IntakeFailure extends Error {
  constructor(readonly code: string, message: string) {
    super(message);
  }
}

/** Where the rows come from: a header record, then data records (arrays of fields in file order). */
export interface IntakeSource {
  records: AsyncIterable<string[]>;
  /** Bytes read so far (for the progress bar), when the source is a file. */
  bytesRead?: () => number;
  /** Whether the source ended with a line break; a short last row without one means a cut-off file. */
  endedWithNewline?: () => boolean;
}

export interface IntakeStart {
  source: UploadSource;
  fileName: string | null;
  tempUnit: TempUnit;
  rainUnit: RainUnit;
  bytesTotal: number;
  actorId: string | null;
}

const NOTHING_KEPT = 'Nothing from it was saved.';
const LINE_BATCH = 1 << 18; // 256 kB of COPY text per write

const copyValue = (v: number | null) => (v === null ? '\\N' : String(v));

/** A CSV file as records, with a binary check on the first bytes and a byte count for the progress. */
export function csvFileSource(path: string): IntakeSource {
  let bytes = 0;
  let last = -1;
  let first = true;
  const decoder = new TextDecoder('utf-8', { fatal: true });
  const sniff = new Transform({
    transform(chunk: Buffer, _enc, cb) {
      if (first) {
        first = false;
        const head = chunk.subarray(0, 64 * 1024);
        let text = true;
        try {
          decoder.decode(head, { stream: true });
        } catch {
          text = false;
        }
        if (!text || head.includes(0))
          return cb(new IntakeFailure('binary_file', `This is not a text CSV file (it holds binary data). ${NOTHING_KEPT} Save the sheet as CSV (UTF-8) and upload that.`));
      }
      bytes += chunk.length;
      last = chunk[chunk.length - 1];
      cb(null, chunk);
    },
  });
  const parser = parse({ bom: true, relax_column_count: true, skip_empty_lines: true, cast: false });
  pipeline(createReadStream(path, { highWaterMark: 1 << 18 }), sniff, parser, () => undefined);
  return { records: parser, bytesRead: () => bytes, endedWithNewline: () => last === 0x0a || last === 0x0d };
}

/** Rows already in memory (the feed's JSON, a one-row correction) as records. */
export function recordsSource(header: string[], rows: string[][]): IntakeSource {
  return {
    records: (async function* () {
      yield header;
      yield* rows;
    })(),
    endedWithNewline: () => true,
  };
}

function csvProblem(err: any): IntakeFailure {
  if (err instanceof IntakeFailure) return err;
  // csv-parse's errors are CsvError; their codes start with CSV_ but for one (INVALID_OPENING_QUOTE).
  if (err instanceof CsvError || (typeof err?.code === 'string' && err.code.startsWith('CSV_'))) {
    const where = err.lines ? ` near line ${err.lines}` : '';
    if (err.code === 'CSV_QUOTE_NOT_CLOSED')
      return new IntakeFailure('truncated_file', `The file ends inside a quoted value${where}: it looks cut off. ${NOTHING_KEPT} Upload the complete file.`);
    return new IntakeFailure('bad_csv', `The file is not valid CSV${where} (${err.message}). ${NOTHING_KEPT}`);
  }
  return err;
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
  async runFile(upload: WeatherUploadEntity, path: string): Promise<void> {
    try {
      await this.run(upload, csvFileSource(path));
    } finally {
      await unlink(path).catch(() => undefined);
    }
  }

  /** Run an intake to its end; the upload row says done or failed (and why). Never throws. */
  async run(upload: WeatherUploadEntity, source: IntakeSource): Promise<void> {
    const { ds, config, logger } = this.ctx;
    const progress = { rows: 0 };
    let beatInFlight: Promise<unknown> = Promise.resolve();
    const beat = () => {
      beatInFlight = ds
        .query(`UPDATE weather_uploads SET heartbeat_at = now(), rows_processed = $2, bytes_processed = $3 WHERE id = $1 AND status = 'processing'`,
          [upload.id, progress.rows, source.bytesRead?.() ?? 0])
        .catch(() => undefined);
    };
    const timer = setInterval(beat, 1000);
    const stopBeat = async () => {
      clearInterval(timer);
      await beatInFlight;
    };
    const qr = ds.createQueryRunner();
    try {
      await qr.connect();
      await qr.startTransaction();
      const result = await this.load(qr.manager, (qr as unknown as { databaseConnection: pg.PoolClient }).databaseConnection, upload, source, progress);
      await stopBeat();
      await qr.query(
        `UPDATE weather_uploads SET status = 'done', rows_processed = $2, rows_accepted = $3, rows_flagged = $4, rows_rejected = $5,
                rows_replaced = $6, bytes_processed = bytes_total, message = $7, heartbeat_at = now(), finished_at = now() WHERE id = $1`,
        [upload.id, result.processed, result.accepted, result.flagged, result.rejected, result.replaced, result.message],
      );
      await recordAudit(qr.manager, {
        actorId: upload.createdBy, action: 'weather.intake-loaded', entity: 'weather_upload', entityId: upload.id,
        after: { source: upload.source, fileName: upload.fileName, ...result },
      });
      await qr.commitTransaction();
    } catch (raw) {
      await stopBeat();
      if (qr.isTransactionActive) await qr.rollbackTransaction().catch(() => undefined);
      const err = csvProblem(raw);
      const known = err instanceof IntakeFailure;
      if (!known) logger.error({ err, uploadId: upload.id }, 'weather intake failed');
      const message = known ? err.message : `The data could not be loaded (${(err as Error).message}). ${NOTHING_KEPT}`;
      await ds.query(
        `UPDATE weather_uploads SET status = 'failed', message = $2, rows_processed = $3, rows_accepted = 0, rows_flagged = 0,
                rows_replaced = 0, finished_at = now() WHERE id = $1 AND status = 'processing'`,
        [upload.id, message, progress.rows],
      ).catch((e) => logger.error({ err: e }, 'could not mark the upload failed'));
    } finally {
      await qr.release();
    }
  }

  private async load(manager: EntityManager, client: pg.PoolClient, upload: WeatherUploadEntity, source: IntakeSource, progress: { rows: number }) {
    const { config } = this.ctx;
    const stations = await stationRefs(manager);
    // The flag windows and joins sort the whole intake: give this transaction room to do it in memory.
    await manager.query("SET LOCAL work_mem = '256MB'");
    const rowCtx: RowContext = {
      stations, tempUnit: upload.tempUnit, rainUnit: upload.rainUnit, lastDay: Math.floor(Date.now() / 86_400_000),
    };
    await manager.query(
      `CREATE TEMP TABLE weather_staging (row_no int NOT NULL, station_id uuid NOT NULL, date date NOT NULL,
         tmin float8 NOT NULL, tmax float8 NOT NULL, rh float8, rain float8) ON COMMIT DROP`,
    );

    const issues: RowIssue[] = [];
    const maxIssues = config.WEATHER_REPORT_MAX_ISSUES;
    let issuesDropped = 0;
    let rejected = 0;
    let accepted = 0;
    let maybeDuplicates = false;
    const lastDayOf = new Map<string, number>();
    const seenStations = new Set<string>();

    const copy = client.query(copyFrom('COPY weather_staging FROM STDIN'));
    const copyDone = finished(copy);
    copyDone.catch(() => undefined);
    let batch = '';
    let header: string[] | null = null;
    let col: ReturnType<typeof readHeader> | null = null;
    let rowNo = 1;
    let shortLast: string[] | null = null;
    const rowIssues: RowIssue[] = [];

    const rejectShort = (rec: string[], n: number) => {
      rejected++;
      if (issues.length < maxIssues)
        issues.push({ rowNumber: n, station: rec[0] ?? null, date: rec[1] ?? null, column: '(row)', value: rec.join(',').slice(0, 200),
          severity: 'rejected', rule: 'column-count', reason: `${REJECT_RULES['column-count']} (${rec.length} of ${header!.length}).` });
      else issuesDropped++;
    };
    try {
      for await (const rec of source.records as AsyncIterable<string[]>) {
        if (!header) {
          header = rec;
          col = readHeader(rec);
          if ('problem' in col) throw new IntakeFailure('bad_header', `${col.problem} ${NOTHING_KEPT}`);
          continue;
        }
        rowNo++;
        progress.rows = rowNo - 1;
        if (shortLast) {
          rejectShort(shortLast, rowNo - 1);
          shortLast = null;
        }
        if (rec.length !== header.length) {
          shortLast = rec;
          continue;
        }
        rowIssues.length = 0;
        const row: CheckedRow | null = checkRow(rec, (col as { index: never }).index, rowNo, rowCtx, rowIssues);
        if (!row) {
          rejected++;
          for (const i of rowIssues) {
            if (issues.length < maxIssues) issues.push(i);
            else issuesDropped++;
          }
          continue;
        }
        accepted++;
        seenStations.add(row.stationId);
        const prev = lastDayOf.get(row.stationId);
        if (prev !== undefined && row.day <= prev) maybeDuplicates = true;
        if (prev === undefined || row.day > prev) lastDayOf.set(row.stationId, row.day);
        batch += `${rowNo}\t${row.stationId}\t${row.date}\t${row.tmin}\t${row.tmax}\t${copyValue(row.rh)}\t${copyValue(row.rain)}\n`;
        if (batch.length >= LINE_BATCH) {
          const ok = copy.write(batch);
          batch = '';
          if (!ok) await Promise.race([once(copy, 'drain'), copyDone]);
        }
      }
      if (!header) throw new IntakeFailure('empty_file', `The file is empty. ${NOTHING_KEPT} Choose the CSV file with the header station, date, tmin, tmax.`);
      if (shortLast) {
        if (source.endedWithNewline && !source.endedWithNewline())
          throw new IntakeFailure('truncated_file', `The file ends in the middle of row ${rowNo} (it has ${shortLast.length} of ${header.length} fields): it looks cut off. ${NOTHING_KEPT} Upload the complete file.`);
        rejectShort(shortLast, rowNo);
      }
    } catch (err) {
      // CopyFail to the server, and wait for its answer, so the connection can roll back.
      copy.destroy();
      await copyDone.catch(() => undefined);
      throw err;
    }
    copy.end(batch);
    await copyDone;
    const processed = rowNo - 1;
    progress.rows = processed;
    if (processed === 0) throw new IntakeFailure('no_rows', `The file has a header but no rows. ${NOTHING_KEPT}`);

    await manager.query('ANALYZE weather_staging');
    if (maybeDuplicates) {
      const dups: { row_no: number; first_row: number; code: string; date: string }[] = await manager.query(
        `WITH d AS (
           DELETE FROM weather_staging s USING weather_staging t
            WHERE s.station_id = t.station_id AND s.date = t.date AND s.row_no > t.row_no
           RETURNING s.row_no, s.station_id, s.date, t.row_no AS first_row)
         SELECT DISTINCT ON (d.row_no) d.row_no, min(d.first_row) OVER (PARTITION BY d.row_no) AS first_row, st.code, to_char(d.date, 'YYYY-MM-DD') AS date
           FROM d JOIN weather_stations st ON st.id = d.station_id ORDER BY d.row_no`,
      );
      for (const d of dups) {
        rejected++;
        accepted--;
        if (issues.length < maxIssues)
          issues.push({ rowNumber: d.row_no, station: d.code, date: d.date, column: '(row)', value: null, severity: 'rejected',
            rule: 'duplicate-row', reason: `The same station and date are on row ${d.first_row}; that first row was kept.` });
        else issuesDropped++;
      }
    }

    // Old values of the rows this intake changes go to the revisions, then the merge (unchanged rows are not touched).
    const [{ n: replaced }] = await manager.query(
      `WITH ins AS (
         INSERT INTO weather_observation_revisions (station_id, date, tmin, tmax, rh, rain, flags, previous_upload_id, replaced_by_upload_id, replaced_by)
         SELECT o.station_id, o.date, o.tmin, o.tmax, o.rh, o.rain, o.flags, o.upload_id, $1, $2
           FROM weather_observations o JOIN weather_staging s ON s.station_id = o.station_id AND s.date = o.date
          WHERE (o.tmin, o.tmax, o.rh, o.rain) IS DISTINCT FROM (s.tmin, s.tmax, s.rh, s.rain)
         RETURNING 1)
       SELECT count(*)::int AS n FROM ins`,
      [upload.id, upload.createdBy],
    );
    await manager.query(
      `INSERT INTO weather_observations AS o (station_id, date, tmin, tmax, rh, rain, upload_id)
       SELECT station_id, date, tmin, tmax, rh, rain, $1 FROM weather_staging ORDER BY station_id, date -- index order: sequential B-tree inserts
       ON CONFLICT (station_id, date) DO UPDATE
         SET tmin = EXCLUDED.tmin, tmax = EXCLUDED.tmax, rh = EXCLUDED.rh, rain = EXCLUDED.rain, upload_id = EXCLUDED.upload_id, updated_at = now()
       WHERE (o.tmin, o.tmax, o.rh, o.rain) IS DISTINCT FROM (EXCLUDED.tmin, EXCLUDED.tmax, EXCLUDED.rh, EXCLUDED.rain)`,
      [upload.id],
    );

    const flagged = await this.applyFlags(manager, upload.id, [...seenStations], maxIssues - issues.length);

    const touched = await refreshAssignments(manager, config.WEATHER_IDW_STATIONS);
    for (const d of await districtsUsingStations(manager, [...seenStations])) touched.add(d);
    await recomputeDistrictSeries(manager, touched, config.WEATHER_FILL_MAX_DAYS);

    await insertIssues(manager, upload.id, issues);
    const listed = issues.length + flagged.listed;
    const more = issuesDropped + flagged.dropped;
    const message = more > 0 ? `The report lists the first ${listed.toLocaleString('en')} findings; ${more.toLocaleString('en')} more were not listed.` : null;
    return { processed, accepted, flagged: flagged.rows, rejected, replaced, message };
  }

  /** The flag rules (docs/weather-intake.md § Flag) on the rows of this intake, after the merge. */
  private async applyFlags(manager: EntityManager, uploadId: string, stationIds: string[], room: number) {
    const { config } = this.ctx;
    const pos: { id: string; latitude: number; longitude: number; elevation: number | null }[] = await manager.query(
      'SELECT id, latitude, longitude, elevation FROM weather_stations',
    );
    const wanted = new Set(stationIds);
    const nb = neighbours(pos, config.WEATHER_QC_NEIGHBOUR_KM).filter((n) => wanted.has(n.stationId));
    await manager.query('CREATE TEMP TABLE weather_nb (station_id uuid, neighbour_id uuid, weight float8, lapse float8) ON COMMIT DROP');
    if (nb.length)
      await manager.query(
        'INSERT INTO weather_nb SELECT * FROM unnest($1::uuid[], $2::uuid[], $3::float8[], $4::float8[])',
        [nb.map((n) => n.stationId), nb.map((n) => n.neighbourId), nb.map((n) => n.weight), nb.map((n) => n.lapse)],
      );
    const run = config.WEATHER_QC_RUN_DAYS;
    await manager.query(
      `CREATE TEMP TABLE weather_flags ON COMMIT DROP AS
       WITH span AS (SELECT station_id, min(date) - $1::int AS lo, max(date) + $1::int AS hi FROM weather_staging GROUP BY station_id),
       seq AS (
         SELECT o.station_id, o.date, o.tmin, o.tmax,
                lag(o.date) OVER w AS pdate, lag(o.tmin) OVER w AS ptmin, lag(o.tmax) OVER w AS ptmax
           FROM weather_observations o JOIN span ON span.station_id = o.station_id AND o.date BETWEEN span.lo AND span.hi
         WINDOW w AS (PARTITION BY o.station_id ORDER BY o.date)),
       runs AS (
         SELECT station_id, date, count(*) OVER (PARTITION BY station_id, tmin, tmax, grp) AS run_len
           FROM (SELECT station_id, date, tmin, tmax, date - (row_number() OVER (PARTITION BY station_id, tmin, tmax ORDER BY date))::int AS grp FROM seq) x),
       est AS (
         SELECT s.station_id, s.date, count(*) AS n,
                sum(nb.weight * (o2.tmin + nb.lapse)) / sum(nb.weight) AS etmin,
                sum(nb.weight * (o2.tmax + nb.lapse)) / sum(nb.weight) AS etmax
           FROM weather_staging s JOIN weather_nb nb ON nb.station_id = s.station_id
           JOIN weather_observations o2 ON o2.station_id = nb.neighbour_id AND o2.date = s.date
          GROUP BY s.station_id, s.date),
       f AS (
         SELECT s.row_no, s.station_id, s.date, s.tmin, s.tmax, q.ptmin, q.ptmax, r.run_len, e.etmin, e.etmax,
                q.pdate = s.date - 1 AND (abs(s.tmax - q.ptmax) > $2 OR abs(s.tmin - q.ptmin) > $2) AS jump,
                r.run_len >= $1 AS run,
                coalesce(e.n >= 2 AND (abs(s.tmax - e.etmax) > $3 OR abs(s.tmin - e.etmin) > $3), false) AS spatial
           FROM weather_staging s
           JOIN seq q ON q.station_id = s.station_id AND q.date = s.date
           JOIN runs r ON r.station_id = s.station_id AND r.date = s.date
           LEFT JOIN est e ON e.station_id = s.station_id AND e.date = s.date)
       SELECT f.*, array_remove(ARRAY[CASE WHEN jump THEN 'jump' END, CASE WHEN run THEN 'run' END, CASE WHEN spatial THEN 'spatial' END], NULL) AS flags
         FROM f WHERE jump OR run OR spatial`,
      [run, config.WEATHER_QC_JUMP_C, config.WEATHER_QC_SPATIAL_C],
    );
    // Clear flags a corrected row no longer earns, then set the new ones.
    await manager.query(
      `UPDATE weather_observations o SET flags = '{}'
         FROM weather_staging s
        WHERE o.station_id = s.station_id AND o.date = s.date AND o.flags <> '{}'
          AND NOT EXISTS (SELECT 1 FROM weather_flags f WHERE f.station_id = s.station_id AND f.date = s.date)`,
    );
    await manager.query(
      `UPDATE weather_observations o SET flags = f.flags FROM weather_flags f
        WHERE o.station_id = f.station_id AND o.date = f.date AND o.flags IS DISTINCT FROM f.flags`,
    );
    const [{ rows, findings }] = await manager.query(
      'SELECT count(*)::int AS rows, coalesce(sum(cardinality(flags)), 0)::int AS findings FROM weather_flags',
    );
    const take = Math.max(0, room);
    await manager.query(
      `INSERT INTO weather_upload_issues (upload_id, row_number, station, date, "column", value, severity, rule, reason)
       SELECT $1, x.row_no, st.code, to_char(x.date, 'YYYY-MM-DD'), x.col, x.val, 'flagged', x.rule, x.reason
         FROM (
           SELECT f.*, 'tmax' AS col, f.tmax::text AS val, 'jump' AS rule,
                  format('Tmin %s → %s, Tmax %s → %s °C from the day before (limit %s °C).', f.ptmin, f.tmin, f.ptmax, f.tmax, $3::float8) AS reason
             FROM weather_flags f WHERE f.jump
           UNION ALL
           SELECT f.*, 'tmax', f.tmax::text, 'run',
                  format('Tmin %s and Tmax %s °C repeated on %s days in a row (limit %s).', f.tmin, f.tmax, f.run_len, $4::int)
             FROM weather_flags f WHERE f.run
           UNION ALL
           SELECT f.*, 'tmax', f.tmax::text, 'spatial',
                  format('Tmin %s / Tmax %s °C against %s / %s °C estimated from the neighbouring stations (limit %s °C).',
                         f.tmin, f.tmax, round(f.etmin::numeric, 1), round(f.etmax::numeric, 1), $5::float8)
             FROM weather_flags f WHERE f.spatial
         ) x JOIN weather_stations st ON st.id = x.station_id
        ORDER BY x.row_no LIMIT $2`,
      [uploadId, take, config.WEATHER_QC_JUMP_C, config.WEATHER_QC_RUN_DAYS, config.WEATHER_QC_SPATIAL_C],
    );
    void FLAG_RULES;
    return { rows: rows as number, listed: Math.min(findings, take), dropped: Math.max(0, findings - take) };
  }

  /** Mark failed every upload whose process stopped touching it (a crash or a kill mid-load). */
  async sweepStale(): Promise<number> {
    const rows = await this.ctx.ds.query(
      `UPDATE weather_uploads SET status = 'failed', finished_at = now(),
              message = 'The server stopped while checking this file, so nothing from it was saved. Upload it again.'
        WHERE status = 'processing' AND heartbeat_at < now() - make_interval(secs => $1) RETURNING id`,
      [this.ctx.config.WEATHER_UPLOAD_STALE_SECONDS],
    );
    return (rows[0] as unknown[] | undefined)?.length ?? 0;
  }
}

async function insertIssues(manager: EntityManager, uploadId: string, issues: RowIssue[]) {
  for (let i = 0; i < issues.length; i += 5000) {
    const part = issues.slice(i, i + 5000);
    await manager.query(
      `INSERT INTO weather_upload_issues (upload_id, row_number, station, date, "column", value, severity, rule, reason)
       SELECT $1, * FROM unnest($2::int[], $3::text[], $4::text[], $5::text[], $6::text[], $7::text[], $8::text[], $9::text[])`,
      [uploadId, part.map((x) => x.rowNumber), part.map((x) => x.station), part.map((x) => x.date), part.map((x) => x.column),
        part.map((x) => x.value), part.map((x) => x.severity), part.map((x) => x.rule), part.map((x) => x.reason)],
    );
  }
}
