import {
  type CheckedRow, checkRow, type ColumnIndex, type RainUnit, readHeader, REJECT_RULES, type RowContext, type RowIssue, type TempUnit,
} from '../../shared/weather/qc';
import { LIMITS } from '../../shared/limits';
import { capText } from '../http/limits';
import { IntakeFailure, type IntakeSource, NOTHING_KEPT } from './intake-source';

/** The stations as the row checks need them, in a list whose positions name them in a batch. */
export interface ReaderStations {
  codes: string[];
  activeFrom: number[];
  activeTo: number[];
}

export interface ReaderOptions {
  stations: ReaderStations;
  tempUnit: TempUnit;
  rainUnit: RainUnit;
  lastDay: number;
  /** Issues listed at most (the rest are counted). */
  maxIssues: number;
}

/** Up to BATCH_ROWS accepted rows in columns (stations by their place in ReaderStations), and the rejected rows' issues. */
export interface CheckedBatch {
  n: number;
  station: Int32Array;
  day: Int32Array;
  row: Int32Array;
  tmin: Float64Array;
  tmax: Float64Array;
  rh: Float64Array;
  rain: Float64Array;
  /** Issues of the rows rejected since the last batch (all of a row's issues, in row order). */
  issues: RowIssue[];
  /** Issues past ReaderOptions.maxIssues, counted only. */
  issuesDropped: number;
  rejected: number;
  /** Data rows read so far, and bytes (when the source counts them). */
  rowsRead: number;
  bytesRead: number;
}

const BATCH_ROWS = 8192;

function newBatch(): CheckedBatch {
  return {
    n: 0, station: new Int32Array(BATCH_ROWS), day: new Int32Array(BATCH_ROWS), row: new Int32Array(BATCH_ROWS),
    tmin: new Float64Array(BATCH_ROWS), tmax: new Float64Array(BATCH_ROWS), rh: new Float64Array(BATCH_ROWS), rain: new Float64Array(BATCH_ROWS),
    issues: [], issuesDropped: 0, rejected: 0, rowsRead: 0, bytesRead: 0,
  };
}

/**
 * The per-record half of the intake: the header, the field count of each row, the row checks
 * (shared/weather/qc.ts) and a cut-off last row, with the accepted rows gathered into batches of
 * columns. (Parsing and checking in a worker thread was measured and was slower on this two-core
 * machine: the database needs the second core for the COPY that runs meanwhile; docs § Speed.)
 */
export class RecordChecker {
  private header: string[] | null = null;
  private col: ColumnIndex | null = null;
  private rowNo = 1;
  private shortLast: string[] | null = null;
  private batch = newBatch();
  private readonly ctx: RowContext;
  private readonly rowIssues: RowIssue[] = [];
  private issuesListed = 0;
  private readonly scratch: CheckedRow = { stationId: '', stationIndex: -1, date: '', day: 0, tmin: 0, tmax: 0, rh: null, rain: null };

  constructor(private readonly opts: ReaderOptions, private readonly emit: (batch: CheckedBatch) => void, private readonly bytesRead: () => number = () => 0) {
    const { codes, activeFrom, activeTo } = opts.stations;
    this.ctx = {
      stations: new Map(codes.map((code, index) => [code, { id: '', index, activeFrom: activeFrom[index], activeTo: activeTo[index] }])),
      tempUnit: opts.tempUnit, rainUnit: opts.rainUnit, lastDay: opts.lastDay,
    };
  }

  /** One record of the file, header first. Throws an IntakeFailure for a header that is not right. */
  push(rec: string[]): void {
    if (!this.header) {
      this.header = rec;
      const col = readHeader(rec);
      if ('problem' in col) throw new IntakeFailure('bad_header', `${col.problem} ${NOTHING_KEPT}`);
      this.col = col.index;
      return;
    }
    this.rowNo++;
    if (this.shortLast) {
      this.rejectShort(this.shortLast, this.rowNo - 1);
      this.shortLast = null;
    }
    if (rec.length !== this.header.length) {
      this.shortLast = rec;
      return;
    }
    if (this.overLong(rec)) return;
    const b = this.batch;
    this.rowIssues.length = 0;
    const row = checkRow(rec, this.col!, this.rowNo, this.ctx, this.rowIssues, this.scratch);
    if (!row) {
      b.rejected++;
      for (const i of this.rowIssues) this.note(i);
    } else {
      const k = b.n++;
      b.station[k] = row.stationIndex;
      b.day[k] = row.day;
      b.row[k] = this.rowNo;
      b.tmin[k] = row.tmin;
      b.tmax[k] = row.tmax;
      b.rh[k] = row.rh ?? Number.NaN;
      b.rain[k] = row.rain ?? Number.NaN;
    }
    if (b.n === BATCH_ROWS || b.rejected === BATCH_ROWS) this.flush();
  }

  private note(issue: RowIssue) {
    if (this.issuesListed < this.opts.maxIssues) {
      this.issuesListed++;
      this.batch.issues.push(issue);
    } else this.batch.issuesDropped++;
  }

  /** The end of the file: a short last row is a cut-off file when no line break ends it. Returns the data rows read. */
  finish(endedWithNewline: boolean): number {
    if (!this.header) throw new IntakeFailure('empty_file', `The file is empty. ${NOTHING_KEPT} Choose the CSV file with the header station, date, tmin, tmax.`);
    if (this.shortLast) {
      if (!endedWithNewline)
        throw new IntakeFailure('truncated_file', `The file ends in the middle of row ${this.rowNo} (it has ${this.shortLast.length} of ${this.header.length} fields): it looks cut off. ${NOTHING_KEPT} Upload the complete file.`, { line: this.rowNo });
      this.rejectShort(this.shortLast, this.rowNo);
      this.shortLast = null;
    }
    this.flush();
    if (this.rowNo === 1) throw new IntakeFailure('no_rows', `The file has a header but no rows. ${NOTHING_KEPT}`);
    return this.rowNo - 1;
  }

  /** Hands on the rows gathered so far. */
  private flush(): void {
    const b = this.batch;
    b.rowsRead = Math.max(0, this.rowNo - 1);
    b.bytesRead = this.bytesRead();
    this.batch = newBatch();
    this.emit(b);
  }

  /**
   * A row holding a value longer than LIMITS.CSV_FIELD_MAX_CHARS is rejected as a whole (its other values
   * are not read), and the report quotes the value's start and says how much was cut.
   */
  private overLong(rec: string[]): boolean {
    let k = 0;
    while (k < rec.length && rec[k].length <= LIMITS.CSV_FIELD_MAX_CHARS) k++;
    if (k === rec.length) return false;
    this.batch.rejected++;
    this.note({
      rowNumber: this.rowNo, station: capText(rec[0] ?? null, LIMITS.VALUE_MAX_CHARS), date: capText(rec[1] ?? null, LIMITS.VALUE_MAX_CHARS),
      column: capText(this.header![k], LIMITS.VALUE_MAX_CHARS), value: capText(rec[k], LIMITS.VALUE_MAX_CHARS), severity: 'rejected', rule: 'field-too-long',
      reason: `${REJECT_RULES['field-too-long']} (${rec[k].length.toLocaleString('en')} characters).`,
      params: { length: rec[k].length, max: LIMITS.CSV_FIELD_MAX_CHARS },
    });
    return true;
  }

  private rejectShort(rec: string[], n: number) {
    this.batch.rejected++;
    this.note({ rowNumber: n, station: capText(rec[0] ?? null, LIMITS.VALUE_MAX_CHARS), date: capText(rec[1] ?? null, LIMITS.VALUE_MAX_CHARS), column: '(row)', value: capText(rec.join(','), LIMITS.VALUE_MAX_CHARS),
      severity: 'rejected', rule: 'column-count', reason: `${REJECT_RULES['column-count']} (${rec.length} of ${this.header!.length}).`,
      params: { fields: rec.length, expected: this.header!.length } });
  }
}

/** Check a source, handing on batches as they fill. Resolves with the data rows read. */
export async function readChecked(source: IntakeSource, opts: ReaderOptions, onBatch: (b: CheckedBatch) => void): Promise<number> {
  const checker = new RecordChecker(opts, onBatch, source.bytesRead);
  await source.read((rec) => checker.push(rec));
  return checker.finish(source.endedWithNewline ? source.endedWithNewline() : true);
}
