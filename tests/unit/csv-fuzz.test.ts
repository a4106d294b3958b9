import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import type { AppContext } from '../../server/app-context';
import type { Principal } from '../../server/auth/principal';
import type { CaseLedgerService } from '../../server/cases/case-ledger.service';
import { CaseUploadService } from '../../server/cases/case-upload.service';
import { csvFileSource, IntakeFailure } from '../../server/weather/weather-intake.service';
import { checkRow, LIMITS, readHeader, type RowContext, type RowIssue } from '../../shared/weather/qc';

/**
 * Fuzzing the two CSV readers (issue 8) with fast-check, 400 generated files each (a bounded amount of
 * work that fits its time limit on a busy machine; new files on every run, no fixed seed):
 * - the weather intake's reader (PapaParse over the file, the binary sniff, the header and row checks)
 *   never fails other than with a message for the sender, and every row it accepts is within the
 *   physical limits;
 * - the case upload never throws, and writes either every row of the file or none (the ledger and the
 *   transaction are stand-ins that record what would be committed).
 */
const dir = mkdtempSync(path.join(os.tmpdir(), 'broodcast-csv-fuzz-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Fields that are mostly plausible, sometimes broken: quotes, separators, units, dates, numbers. */
const field = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom('S1', 'S2', 's1', 'HV-01', 'HV-02', 'hv-01', 'DENV', 'denv', 'X') },
  { weight: 3, arbitrary: fc.integer({ min: -120, max: 2200 }).map(String) },
  { weight: 2, arbitrary: fc.tuple(fc.double({ min: -200, max: 2000, noNaN: true }), fc.nat(3)).map(([n, digits]) => n.toFixed(digits)) },
  { weight: 2, arbitrary: fc.date({ min: new Date('1985-01-01'), max: new Date('2030-12-31'), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10)) },
  { weight: 1, arbitrary: fc.constantFrom('', ' ', '"', '""', '"a,b"', '"unclosed', 'NaN', 'Infinity', '1e5', '-0', '12,5', '2025-02-30', '31/12/2025', '\t', '\u0000', '\uFEFF', '٣', '１２') },
  { weight: 1, arbitrary: fc.string({ maxLength: 12 }) },
);
const line = (n: number) => fc.array(field, { minLength: Math.max(0, n - 2), maxLength: n + 2 }).map((fs) => fs.join(','));
const eol = fc.constantFrom('\n', '\r\n', '\r');
/** A header (usually the right one, sometimes reordered, renamed or missing a column), rows, line ends. */
const csvFile = (columns: string[], validRow: fc.Arbitrary<string>) =>
  fc.tuple(
    fc.oneof(
      { weight: 4, arbitrary: fc.constant(columns) },
      { weight: 2, arbitrary: fc.shuffledSubarray(columns, { minLength: 1 }) },
      { weight: 1, arbitrary: fc.array(fc.oneof(fc.constantFrom(...columns), fc.string({ maxLength: 6 })), { maxLength: 8 }) },
    ),
    fc.oneof(fc.array(line(columns.length), { maxLength: 25 }), fc.array(fc.oneof({ weight: 8, arbitrary: validRow }, { weight: 1, arbitrary: line(columns.length) }), { maxLength: 25 })),
    eol,
    fc.boolean(),
    fc.boolean(),
  ).map(([header, rows, end, bom, trailing]) => `${bom ? '\uFEFF' : ''}${[header.join(','), ...rows].join(end)}${trailing ? end : ''}`);

const validWeatherRow = fc
  .tuple(fc.constantFrom('S1', 'S2'), fc.date({ min: new Date('2021-01-01'), max: new Date('2025-12-31'), noInvalidDate: true }), fc.integer({ min: -5, max: 25 }), fc.integer({ min: 1, max: 15 }),
    fc.integer({ min: 0, max: 100 }), fc.integer({ min: 0, max: 80 }))
  .map(([s, d, tmin, spread, rh, rain]) => `${s},${d.toISOString().slice(0, 10)},${tmin},${tmin + spread},${rh},${rain}`);
const validCaseRow = fc
  .tuple(fc.constantFrom('HV-01', 'hv-01'), fc.constantFrom(2024, 2025), fc.integer({ min: 1, max: 52 }), fc.constantFrom('DENV', 'denv'), fc.integer({ min: 0, max: 500 }))
  .map((fs) => fs.join(','));

describe('fuzzing the weather CSV reader', () => {
  const ctx: RowContext = {
    stations: new Map([
      ['S1', { id: '00000000-0000-4000-8000-000000000001', activeFrom: -Infinity, activeTo: Infinity }],
      ['S2', { id: '00000000-0000-4000-8000-000000000002', activeFrom: Date.UTC(2020, 0, 1) / 86_400_000, activeTo: Infinity }],
    ]),
    tempUnit: 'C', rainUnit: 'mm', lastDay: Math.floor(Date.now() / 86_400_000),
  };

  it('when generated files are read and checked, then it ends with a message for the sender or rows within the limits, never an unexplained error', async () => {
    let n = 0;
    const outcomes = { files: 0, failures: 0, accepted: 0, rejected: 0 };
    await fc.assert(
      fc.asyncProperty(fc.oneof({ weight: 9, arbitrary: csvFile(['station', 'date', 'tmin', 'tmax', 'rh', 'rain'], validWeatherRow).map((s) => Buffer.from(s)) },
        { weight: 1, arbitrary: fc.uint8Array({ maxLength: 300 }).map((b) => Buffer.from(b)) }), async (bytes) => {
        const file = path.join(dir, `w-${n++}.csv`);
        writeFileSync(file, bytes);
        outcomes.files++;
        try {
          let col: ReturnType<typeof readHeader> | null = null;
          let header: string[] | null = null;
          let rowNo = 1;
          await csvFileSource(file).read((rec) => {
            if (!header) {
              header = rec;
              col = readHeader(rec);
              if ('problem' in col) expect(col.problem).toMatch(/\w/);
              return;
            }
            if ('problem' in col!) return;
            rowNo++;
            if (rec.length !== header.length) return; // counted as a column-count rejection by the intake
            const issues: RowIssue[] = [];
            const row = checkRow(rec, (col as { index: never }).index, rowNo, ctx, issues);
            if (row) {
              outcomes.accepted++;
              for (const v of [row.tmin, row.tmax]) expect(v >= LIMITS.tempMinC && v <= LIMITS.tempMaxC, `temperature ${v}`).toBe(true);
              expect(row.tmin <= row.tmax).toBe(true);
              if (row.rh !== null) expect(row.rh >= LIMITS.rhMin && row.rh <= LIMITS.rhMax).toBe(true);
              if (row.rain !== null) expect(row.rain >= 0 && row.rain <= LIMITS.rainMaxMm).toBe(true);
              expect(row.day <= ctx.lastDay).toBe(true);
            } else {
              outcomes.rejected++;
              expect(issues.length, `a rejected row names why: ${rec.join(',')}`).toBeGreaterThan(0);
              for (const i of issues) expect(i.reason).toMatch(/\w/);
            }
          });
        } catch (err) {
          // The only failures allowed: the binary sniff, or the parser's quote errors, each an IntakeFailure worded for the
          // sender (the intake keeps nothing).
          outcomes.failures++;
          const known = err instanceof IntakeFailure;
          expect(known, String(err)).toBe(true);
        }
      }),
      { numRuns: 400 },
    );
    expect(outcomes.accepted).toBeGreaterThan(0);
    expect(outcomes.rejected).toBeGreaterThan(0);
  }, 60_000);
});

describe('fuzzing the case upload', () => {
  const districts = [
    { id: '00000000-0000-4000-8000-0000000000d1', code: 'HV-01', name: 'One', createdAt: new Date('2015-01-01') },
    { id: '00000000-0000-4000-8000-0000000000d2', code: 'HV-02', name: 'Two', createdAt: new Date('2015-01-01') },
  ];
  const diseases = [{ id: '00000000-0000-4000-8000-0000000000e1', code: 'DENV', name: 'Dengue', profileIds: [] }];

  /** The ledger and the database as stand-ins: writes go to the open transaction and land only when it commits. */
  function harness() {
    const committed: unknown[] = [];
    let open: unknown[] | null = null;
    const manager = { insert: async (_e: unknown, v: unknown) => { open!.push(v); } };
    const ctx = {
      ds: {
        async transaction(work: (m: typeof manager) => Promise<unknown>) {
          open = [];
          try {
            const out = await work(manager);
            committed.push(...open);
            return out;
          } finally {
            open = null;
          }
        },
      },
    } as unknown as AppContext;
    const ledger = {
      repo: {
        districts: async () => districts,
        diseases: async () => diseases,
        activeFrom: async () => new Map(districts.map((d) => [d.id, '2015-01-01'])),
      },
      today: () => '2026-06-30',
      async writeCount(_m: unknown, _a: unknown, district: { id: string }, _af: string, disease: { id: string }, week: { year: number; week: number }, values: { cases: number }) {
        if (week.year === 2026 && week.week > 26) {
          const { HttpError } = await import('../../server/http/errors');
          throw new HttpError(400, 'bad_week', 'bad week', [{ path: 'week', message: 'has not started yet' }]);
        }
        open!.push({ district: district.id, disease: disease.id, ...week, ...values });
        return { outcome: 'created' as const, count: { late: false } };
      },
    } as unknown as CaseLedgerService;
    return { service: new CaseUploadService(ctx, ledger), committed };
  }
  const epi: Principal = { userId: '00000000-0000-4000-8000-0000000000aa', role: 'epidemiologist', districtIds: [districts[0].id] } as Principal;

  it('when generated files are uploaded, then every row is written or none, and a refused file names its problems', async () => {
    const tally = { accepted: 0, refused: 0 };
    await fc.assert(
      fc.asyncProperty(fc.oneof({ weight: 9, arbitrary: csvFile(['district', 'year', 'week', 'disease', 'cases'], validCaseRow) }, { weight: 1, arbitrary: fc.string({ maxLength: 200 }) }), async (text) => {
        const { service, committed } = harness();
        const report = await service.upload(epi, { buffer: Buffer.from(text), originalname: 'fuzz.csv' });
        if (report.accepted) {
          tally.accepted++;
          expect(report.problems).toEqual([]);
          // The rows written plus the audit record, all in the one transaction.
          expect(committed.length).toBe(report.created === 0 && report.corrected === 0 ? report.rows : report.rows + 1);
          expect(report.created).toBe(report.rows);
        } else {
          tally.refused++;
          expect(committed, 'a refused file writes nothing').toEqual([]);
          expect(report.created + report.corrected + report.unchanged).toBe(0);
          expect(report.problems.length).toBeGreaterThan(0);
          for (const p of report.problems) expect(p.reason).toMatch(/\w/);
        }
      }),
      { numRuns: 400 },
    );
    expect(tally.refused).toBeGreaterThan(0);
    expect(tally.accepted).toBeGreaterThan(0);
  }, 60_000);
});
