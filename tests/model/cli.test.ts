import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { resolve } from 'node:path';
import { readFileSync } from 'node:fs';

const ROOT = resolve(import.meta.dirname, '../..');

interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

/**
 * One CLI run: `node --import tsx` (one process; the tsx launcher would start a second node) and at most
 * two at a time, so the work per moment is bounded whatever the machine's load (seven at once used to
 * time out on a busy two-core machine).
 */
let running = 0;
const waiting: (() => void)[] = [];
async function cli(args: string[], stdin = ''): Promise<Run> {
  if (running >= 2) await new Promise<void>((r) => waiting.push(r));
  running++;
  try {
    return await new Promise<Run>((res, rej) => {
      const p = spawn(process.execPath, ['--import', 'tsx', 'cli/model.cli.ts', ...args], { cwd: ROOT, stdio: ['pipe', 'pipe', 'pipe'] });
      let stdout = '';
      let stderr = '';
      p.stdout.on('data', (d) => (stdout += d));
      p.stderr.on('data', (d) => (stderr += d));
      p.on('error', rej);
      p.on('close', (code) => res({ code, stdout, stderr }));
      p.stdin.end(stdin);
    });
  } finally {
    running--;
    waiting.shift()?.();
  }
}
const lines = (s: string) => s.trim().split('\n').map((l) => JSON.parse(l));

// MASS::quine and MASS::ships with R 4.2.2 / MASS 7.3-58.2 glm.nb results (see negative-binomial.test.ts).
const nbReference = JSON.parse(readFileSync(resolve(ROOT, 'tests/model/fixtures/negative-binomial-reference.json'), 'utf8')) as {
  cases: { y: number[]; x: number[][]; offset?: number[]; coefficients: number[]; theta: number; logLik: number }[];
};
const [quine, ships] = nbReference.cases;

// All runs are queued at once (two run at a time), the checks below read their results.
const runs = {
  degreeDays: cli(['degree-days', '--method', 'single-sine', '--cutoff', 'vertical', '--lower', '10', '--upper', '30', '--tmin', '20', '--tmax', '35']),
  badOption: cli(['degree-days', '--method', 'single-sine', '--lower', '10', '--upper', '30', '--tmin', 'warm', '--tmax', '35']),
  batch: cli(
    ['degree-days', '--batch', '--lower', '0', '--upper', '30'],
    '{"method":"average","tmin":-2,"tmax":8}\n{"method":"sideways","tmin":1,"tmax":2}\n{"method":"average-clamped","tmin":-2,"tmax":8}\n',
  ),
  daylength: cli(['daylength', '--lat', '40', '--date', '2023-06-21', '--definition', 'sunrise']),
  epiweek: cli(['epiweek', '--batch'], '{"date":"2026-01-03","system":"mmwr"}\n{"date":"2021-01-03","system":"iso"}\n'),
  eip: cli(['eip', '--profile', 'anopheles-falciparum', '--temp', '25']),
  fitNb: cli(
    ['fit-nb', '--batch'],
    [JSON.stringify({ y: ships.y, x: ships.x, offset: ships.offset }), '{"y": [1, 2, 3], "x": [[1], [2]]}', '{"y": "many", "x": []}', JSON.stringify({ y: quine.y, x: quine.x })].join('\n') + '\n',
  ),
  season: cli(['season', '--profile', 'culex-wnv', '--lat', '33.5', '--biofix', '2024-06-01'], 'date,tmin,tmax,rh\n2024-06-01,18,30,60\n2024-06-02,,,\n2024-06-03,19,31,\n'),
};

describe('command line (spawned: node + tsx cli/model.cli.ts)', { timeout: 30_000 }, () => {
  it('when degree-days is asked for single sine with a vertical cutoff, then it prints {"degreeDays": 8.392} [derived, CHECK-VALUES Celsius cutoffs]', async () => {
    const r = await runs.degreeDays;
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).degreeDays).toBeCloseTo(8.392, 3);
  });
  it('when an option has a bad value, then one stderr line names the option and the exit code is 2', async () => {
    const r = await runs.badOption;
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/--tmin/);
  });
  it('when --batch has a bad line in the middle, then that line prints {"error"} naming the key and the others go on (exit 0); McMaster & Wilhelm 1997 Table 1 values', async () => {
    const r = await runs.batch;
    expect(r.code).toBe(0);
    const out = lines(r.stdout);
    expect(out).toHaveLength(3);
    expect(out[0]).toEqual({ degreeDays: 3 });
    expect(out[1].error).toMatch(/^method/);
    expect(out[2]).toEqual({ degreeDays: 4 });
  });
  it('when daylength at 40° N on 2023-06-21 (day 172), then 15.02 hours (Forsythe et al. 1995) [derived]', async () => {
    const r = await runs.daylength;
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).hours).toBeCloseTo(15.02, 2);
  });
  it('when epiweek --batch gets year-boundary dates, then MMWR and ISO weeks 53 come back in order [derived from the rules]', async () => {
    const r = await runs.epiweek;
    expect(lines(r.stdout)).toEqual([
      { year: 2025, week: 53, start: '2025-12-28' },
      { year: 2020, week: 53, start: '2020-12-28' },
    ]);
  });
  it('when eip for P. falciparum at 25 °C, then 12.33 days with the 18 °C threshold as the high end (Macdonald 1957) [derived]', async () => {
    const r = await runs.eip;
    const out = JSON.parse(r.stdout);
    expect(out.days).toBeCloseTo(12.33, 2);
    expect(out.high).toBeCloseTo(111 / 7, 6);
  });
  it('when season reads a small CSV with a gap, then one JSON line per day with the vector clock, the gap null and the total incomplete', async () => {
    const r = await runs.season;
    expect(r.code).toBe(0);
    const out = lines(r.stdout);
    expect(out.map((d) => d.date)).toEqual(['2024-06-01', '2024-06-02', '2024-06-03']);
    for (const k of ['degreeDays', 'cumulativeDegreeDays', 'generations', 'eipDays', 'survival', 'relativeVectorialCapacity', 'seasonOpen']) expect(out[0]).toHaveProperty(k);
    expect(out[1].degreeDays).toBeNull();
    expect(out.map((d) => d.complete)).toEqual([true, false, false]);
    expect(out[2].cumulativeDegreeDays).toBeCloseTo(out[0].degreeDays + out[2].degreeDays, 9);
  });
  it('when fit-nb --batch gets MASS::ships (with an offset), a bad line, a line of the wrong type and MASS::quine, then the two fits match R glm.nb and the bad lines print {"error"} naming the key (exit 0)', async () => {
    const r = await runs.fitNb;
    expect(r.code).toBe(0);
    const out = lines(r.stdout);
    expect(out).toHaveLength(4);
    for (const [i, ref] of [[0, ships], [3, quine]] as const) {
      out[i].coefficients.forEach((b: number, j: number) => expect(Math.abs(b / ref.coefficients[j] - 1)).toBeLessThan(1e-6));
      expect(Math.abs(out[i].theta / ref.theta - 1)).toBeLessThan(1e-4);
      expect(Math.abs(out[i].logLik / ref.logLik - 1)).toBeLessThan(1e-8);
      expect(out[i].iterations).toBeGreaterThan(0);
    }
    expect(out[1].error).toMatch(/^x: /);
    expect(out[2].error).toMatch(/^y: /);
  });
});
