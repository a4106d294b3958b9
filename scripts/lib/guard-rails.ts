/**
 * The guard rails `npm test` runs before the tests when no file is named (and `npm run check` on its
 * own): the type check (tsc), ESLint's type-aware rules (eslint.config.js: no floating promises) and
 * the layer rules (.dependency-cruiser.cjs: shared is pure, client and server apart, no cycles).
 * Each is the tool's own CLI, run one after the other; the output of a failing one is printed whole.
 */
import { spawn } from 'node:child_process';
import { projectDir } from './dev-database';

const SOURCES = ['src', 'server', 'shared', 'jobs', 'cli', 'bench', 'scripts', 'tests', 'sample'];

export const guardRails: { name: string; args: string[] }[] = [
  { name: 'type check (tsc)', args: ['node_modules/typescript/bin/tsc', '--noEmit', '-p', 'tsconfig.json'] },
  { name: 'lint (eslint)', args: ['node_modules/eslint/bin/eslint.js', '--max-warnings=0', ...SOURCES] },
  {
    name: 'layer rules (dependency-cruiser)',
    args: ['node_modules/dependency-cruiser/bin/dependency-cruise.mjs', '--config', '.dependency-cruiser.cjs', '--output-type', 'err', ...SOURCES],
  },
];

function run(args: string[]): Promise<{ code: number; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, args, { cwd: projectDir, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout.on('data', (d: Buffer) => (output += d.toString()));
    child.stderr.on('data', (d: Buffer) => (output += d.toString()));
    child.once('exit', (code, signal) => resolve({ code: code ?? (signal ? 1 : 0), output }));
  });
}

/** Runs every guard rail; true when all pass. */
export async function runGuardRails(): Promise<boolean> {
  let ok = true;
  for (const rail of guardRails) {
    const t0 = Date.now();
    const { code, output } = await run(rail.args);
    const secs = ((Date.now() - t0) / 1000).toFixed(1);
    if (code === 0) console.log(`› ${rail.name}: passed in ${secs} s`);
    else {
      ok = false;
      console.error(`✗ ${rail.name} failed (${secs} s):\n${output.trim()}`);
    }
  }
  return ok;
}
