import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { signalCommands } from '../../cli/commands/signals.commands';

// The command objects of `npm run --silent model -- <command> --batch` (cli/command.ts contract), and
// one run of the real CLI (cli/model.cli.ts; skipped only if that file is missing).
// Check values as in the unit tests: CHECK-VALUES.md and hand computations [derived].

const command = (name: string) => {
  const c = signalCommands.find((x) => x.name === name);
  if (!c?.run) throw new Error(`no runnable command ${name}`);
  return { input: c.input, run: c.run };
};

/** What the CLI does with one batch line: parse with the command's schema, then run. */
const runLine = (name: string, line: unknown) => {
  const c = command(name);
  return c.run(c.input.parse(line));
};

describe('signal commands', () => {
  it('when the commands are listed, then channel, aberration and cusum each have a summary and a schema', () => {
    expect(signalCommands.map((c) => c.name)).toEqual(['channel', 'aberration', 'cusum']);
    for (const c of signalCommands) {
      expect(c.summary.length).toBeGreaterThan(10);
      expect(typeof c.input.safeParse).toBe('function');
    }
  });

  it('when channel gets the quartile history 10, 20, 15, 30, 25, 12, then it prints 12.75, 17.5, 23.75 [derived]', () => {
    // type 7 quartiles (Hyndman & Fan 1996) — arithmetic in endemic-channel.test.ts
    expect(runLine('channel', { method: 'quartile', history: [10, 20, 15, 30, 25, 12] })).toEqual({
      lower: 12.75,
      centre: 17.5,
      upper: 23.75,
    });
  });

  it('when channel gets an unknown method or a negative count, then its schema rejects the line', () => {
    const { input } = command('channel');
    expect(input.safeParse({ method: 'median', history: [1, 2, 3] }).success).toBe(false);
    expect(input.safeParse({ method: 'geometric', history: [1, -2, 3] }).success).toBe(false);
  });

  it('when aberration c1 gets the CHECK-VALUES baseline then 6, then week 7 has 3.674 and alarms [derived]', () => {
    // (6 − 3) / 0.816497 = 3.674235 (Hutwagner et al. 2003, J. Urban Health 80(Suppl 1):i89–i96)
    const r = runLine('aberration', { method: 'c1', series: [2, 3, 4, 3, 2, 3, 4, 6] }) as {
      statistic: (number | null)[];
      alarm: (boolean | null)[];
    };
    expect(r.statistic[7]).toBeCloseTo(3.674235, 5);
    expect(r.alarm).toEqual([null, null, null, null, null, null, null, true]);
  });

  it('when cusum gets the hand-computed series, then it prints S and the alarms [derived]', () => {
    // S = 0, 1.5, 4, 2.5, 6, 10.5 (see cusum.test.ts)
    expect(runLine('cusum', { series: [3, 5, 6, 2, 7, 8], mean: 3, sd: 1, k: 0.5, h: 4 })).toEqual({
      statistic: [0, 1.5, 4, 2.5, 6, 10.5],
      alarm: [false, false, false, false, true, true],
    });
  });
});

const CLI = 'cli/model.cli.ts';

describe.runIf(existsSync(CLI))('model CLI, channel --batch', () => {
  it('when one good and one bad line are piped in, then it prints one result per line, the bad one as an error', () => {
    const input = [
      JSON.stringify({ method: 'quartile', history: [10, 20, 15, 30, 25, 12] }),
      JSON.stringify({ method: 'quartile', history: [1, -2] }),
    ].join('\n');
    const out = spawnSync(process.execPath, ['--import', 'tsx', CLI, 'channel', '--batch'], { input, encoding: 'utf8' });
    expect(out.status).toBe(0); // batch mode reports a bad line in its place and carries on
    const lines = out.stdout.trim().split('\n');
    expect(lines).toHaveLength(2);
    expect(JSON.parse(lines[0])).toEqual({ lower: 12.75, centre: 17.5, upper: 23.75 });
    expect(JSON.parse(lines[1])).toHaveProperty('error');
  }, 30_000);
});
