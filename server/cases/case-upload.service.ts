import { createHash } from 'node:crypto';
import { Readable } from 'node:stream';
import { parse } from 'csv-parse';
import type { UploadProblem, UploadReport } from '../../shared/api/cases.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { HttpError } from '../http/errors';
import { capText, LIMITS } from '../http/limits';
import type { CaseLedgerService } from './case-ledger.service';

/** Columns of the case upload (docs/case-ledger.md): district code, epidemiological year and week, disease code, cases. */
export const UPLOAD_COLUMNS = ['district', 'year', 'week', 'disease', 'cases'] as const;
export const UPLOAD_MAX_BYTES = 2 * 1024 * 1024;
export const UPLOAD_MAX_ROWS = 10_000;
/** Problems listed in one report; the rest are counted in the message. */
const MAX_PROBLEMS = 200;

interface ParsedRow {
  row: number;
  districtId: string;
  diseaseId: string;
  year: number;
  week: number;
  cases: number;
}

/** Thrown inside the transaction to roll back every row when one of them is refused. */
class Rejected extends Error {}

const wholeNumber = /^\d+$/;

/** The column a service error is about, for the row report. */
const columnOf = (path: string | undefined) =>
  path === 'week' || path === 'year' ? path : path === 'reason' || path === 'cases' || path === 'ageBands' ? 'cases' : null;

export class CaseUploadService {
  constructor(
    private readonly ctx: AppContext,
    private readonly ledger: CaseLedgerService,
  ) {}

  /** Read a CSV of weekly counts; all rows are written in one transaction, or none. The same file twice changes nothing. */
  async upload(actor: Principal, file: { buffer: Buffer; originalname: string }, reason?: string): Promise<UploadReport> {
    const problems: UploadProblem[] = [];
    // Every quoted value and reason capped (docs/security.md § Limits): the report stays small whatever the file holds.
    const add = (p: UploadProblem) => {
      problems.push({ ...p, column: capText(p.column, LIMITS.VALUE_MAX_CHARS), value: capText(p.value, LIMITS.VALUE_MAX_CHARS), reason: capText(p.reason) });
    };
    const parsed: ParsedRow[] = [];
    let rows = 0;

    const [districts, diseases] = await Promise.all([this.ledger.repo.districts(undefined), this.ledger.repo.diseases()]);
    const districtByCode = new Map(districts.map((d) => [d.code.toUpperCase(), d]));
    const diseaseByCode = new Map(diseases.map((d) => [d.code.toUpperCase(), d]));
    const activeFrom = await this.ledger.repo.activeFrom(districts);

    // csv-parse reads the file as a stream (quoted fields, a byte-order mark, CRLF line ends).
    let headerChecked = false;
    const parser = Readable.from(file.buffer).pipe(
      parse({
        bom: true,
        trim: true,
        skip_empty_lines: true,
        relax_column_count: true,
        info: true,
        // A line past the limit ends the read with a problem naming it, instead of buffering it whole.
        max_record_size: LIMITS.CSV_LINE_MAX_BYTES,
        columns: (header: string[]) => {
          const columns = header.map((h) => h.trim().toLowerCase());
          const missing = UPLOAD_COLUMNS.filter((c) => !columns.includes(c));
          const extra = columns.filter((c) => !(UPLOAD_COLUMNS as readonly string[]).includes(c));
          for (const c of missing) add({ row: 1, column: c, value: null, reason: `the header has no "${c}" column (expected: ${UPLOAD_COLUMNS.join(', ')})` });
          for (const c of extra) add({ row: 1, column: c, value: c, reason: `"${c}" is not a column of the case upload (expected: ${UPLOAD_COLUMNS.join(', ')})` });
          // A column named twice would let the last one win silently: refuse it, naming the column.
          for (const c of new Set(columns.filter((name, i) => columns.indexOf(name) !== i)))
            add({ row: 1, column: c, value: c, reason: `the header names "${c}" more than once` });
          headerChecked = true;
          return columns;
        },
      }),
    );
    const seen = new Map<string, number>();
    try {
      for await (const { record, info } of parser as AsyncIterable<{ record: Record<string, string | undefined>; info: { lines: number } }>) {
        if (problems.length && rows === 0) break; // a wrong header: no row can be read
        rows += 1;
        if (rows > UPLOAD_MAX_ROWS) {
          add({ row: info.lines, column: null, value: null, reason: `the file has more than ${UPLOAD_MAX_ROWS} rows: split it` });
          break;
        }
        const row = info.lines;
        const value = (c: (typeof UPLOAD_COLUMNS)[number]) => record[c] ?? '';
        const rowProblems: UploadProblem[] = [];
        const bad = (column: string, reason: string) => rowProblems.push({ row, column, value: record[column] ?? null, reason });
        const long = UPLOAD_COLUMNS.find((c) => (record[c]?.length ?? 0) > LIMITS.CSV_FIELD_MAX_CHARS);
        if (long) {
          bad(long, `is longer than ${LIMITS.CSV_FIELD_MAX_CHARS.toLocaleString('en')} characters`);
          rowProblems.forEach(add);
          continue;
        }

        const district = districtByCode.get(value('district').toUpperCase());
        if (!value('district')) bad('district', 'is empty');
        else if (!district) bad('district', 'is not the code of a known district');
        else if (actor.role === 'epidemiologist' && !actor.districtIds.includes(district.id)) bad('district', 'is not one of your assigned districts');
        const disease = diseaseByCode.get(value('disease').toUpperCase());
        if (!value('disease')) bad('disease', 'is empty');
        else if (!disease) bad('disease', `is not the code of a known disease (known: ${diseases.map((d) => d.code).join(', ')})`);
        const year = wholeNumber.test(value('year')) ? Number(value('year')) : null;
        if (year === null || year < 1990 || year > 2100) bad('year', 'must be a year, 1990 to 2100');
        const week = wholeNumber.test(value('week')) ? Number(value('week')) : null;
        if (week === null || week < 1 || week > 53) bad('week', 'must be a whole week number between 1 and 53');
        const cases = wholeNumber.test(value('cases')) ? Number(value('cases')) : null;
        if (cases === null) bad('cases', /^-/.test(value('cases')) ? 'cannot be negative' : 'must be a whole number of cases (0 or more)');
        else if (cases > 1_000_000) bad('cases', 'is implausibly large (over 1,000,000)');

        if (rowProblems.length === 0) {
          const key = `${district!.id}:${disease!.id}:${year}:${week}`;
          const first = seen.get(key);
          if (first !== undefined) bad('week', `repeats row ${first} (same district, disease and week)`);
          else seen.set(key, row);
        }
        if (rowProblems.length) rowProblems.forEach(add);
        else parsed.push({ row, districtId: district!.id, diseaseId: disease!.id, year: year!, week: week!, cases: cases! });
      }
    } catch (err) {
      const e = err as { code?: string; lines?: number; message: string };
      add({ row: e.lines ?? rows + 1, column: null, value: null, reason: `the file is not readable as CSV: ${e.message}` });
    }
    if (!headerChecked) add({ row: 1, column: null, value: null, reason: `the file is empty (expected a header: ${UPLOAD_COLUMNS.join(', ')})` });
    else if (rows === 0 && problems.length === 0)
      add({ row: 1, column: null, value: null, reason: `the file has a header but no rows of counts (expected one row per district, disease and week)` });

    const report: UploadReport = { accepted: false, rows, created: 0, corrected: 0, unchanged: 0, late: 0, problems };
    if (problems.length) return this.rejected(report);

    const today = this.ledger.today();
    const byId = new Map(districts.map((d) => [d.id, d]));
    const diseaseById = new Map(diseases.map((d) => [d.id, d]));
    try {
      await this.ctx.ds.transaction(async (manager) => {
        for (const r of parsed) {
          try {
            const out = await this.ledger.writeCount(
              manager, actor, byId.get(r.districtId)!, activeFrom.get(r.districtId)!, diseaseById.get(r.diseaseId)!,
              { year: r.year, week: r.week }, { cases: r.cases }, { reason, source: 'upload', today },
            );
            report[out.outcome] += 1;
            if (out.outcome === 'created' && out.count.late) report.late += 1;
          } catch (err) {
            if (!(err instanceof HttpError)) throw err;
            const field = err.fields?.[0];
            const column = err.status === 403 ? 'district' : columnOf(field?.path);
            const value = column === 'district' ? byId.get(r.districtId)!.code : column === 'year' ? String(r.year) : column === 'week' ? String(r.week) : String(r.cases);
            add({ row: r.row, column, value, reason: field ? `${field.path} ${field.message}` : err.message });
          }
        }
        if (problems.length) throw new Rejected();
        if (report.created + report.corrected > 0)
          await recordAudit(manager, {
            actorId: actor.userId, action: 'case-upload.accepted', entity: 'case_upload',
            entityId: createHash('sha256').update(file.buffer).digest('hex'),
            after: { file: file.originalname, rows, created: report.created, corrected: report.corrected, unchanged: report.unchanged },
            reason: reason ?? null,
          });
      });
    } catch (err) {
      if (err instanceof Rejected) return this.rejected({ ...report, created: 0, corrected: 0, unchanged: 0, late: 0 });
      throw err;
    }
    return { ...report, accepted: true };
  }

  private rejected(report: UploadReport): UploadReport {
    const shown = report.problems.slice(0, MAX_PROBLEMS);
    const more = report.problems.length - shown.length;
    return { ...report, accepted: false, problems: shown, ...(more > 0 ? { problems: [...shown, { row: 0, column: null, value: null, reason: `and ${more} more problems` }] } : {}) };
  }
}
