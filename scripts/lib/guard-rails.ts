/**
 * The guard rails `npm test` runs before the tests when no file is named (and `npm run check` on its
 * own): the type check (tsc), ESLint's type-aware rules (eslint.config.js: no floating promises) and
 * the layer rules (.dependency-cruiser.cjs: shared is pure, client and server apart, no cycles) and, in
 * `npm test`, that the entities match the migrations (TypeORM's drift check on the test template).
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

function run(args: string[], env?: Record<string, string>): Promise<{ code: number; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, args, { cwd: projectDir, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, ...env } });
    let output = '';
    child.stdout.on('data', (d: Buffer) => (output += d.toString()));
    child.stderr.on('data', (d: Buffer) => (output += d.toString()));
    child.once('exit', (code, signal) => resolve({ code: code ?? (signal ? 1 : 0), output }));
  });
}

/**
 * The entities and the migrations agree: TypeORM's `migration:generate --check` against a database the
 * migrations just built finds nothing to generate (a drift names the statements it would write).
 */
export const migrationCheck = (databaseUrl: string) => ({
  name: 'entities match the migrations (typeorm migration:generate --check)',
  args: [
    'node_modules/tsx/dist/cli.mjs', 'node_modules/typeorm/cli.js', 'migration:generate', '--check',
    '-d', 'server/db/data-source.ts', 'server/db/migrations/Check',
  ],
  env: { DATABASE_URL: databaseUrl },
});

/** Runs every guard rail (and the migration check when a migrated database is given); true when all pass. */
export async function runGuardRails(migratedDatabaseUrl?: string): Promise<boolean> {
  let ok = true;
  const rails: { name: string; args: string[]; env?: Record<string, string> }[] = [...guardRails];
  if (migratedDatabaseUrl) rails.push(migrationCheck(migratedDatabaseUrl));
  for (const rail of rails) {
    const t0 = Date.now();
    const { code, output } = await run(rail.args, rail.env);
    const secs = ((Date.now() - t0) / 1000).toFixed(1);
    if (code === 0) console.log(`› ${rail.name}: passed in ${secs} s`);
    else {
      ok = false;
      console.error(`✗ ${rail.name} failed (${secs} s):\n${output.trim()}`);
    }
  }
  return ok;
}
