/**
 * `npm run bench:drills`: every fault drill in turn (SIGKILL during weather upload, case upload and
 * season run; PostgreSQL stopped; mail server stopped during a bulletin send), each in its own process
 * with its output shown as it runs. Arguments pass on (`-- --quick`, `-- --repeat 3`); `--only kill,mail`
 * picks drills. The last line is one JSON object: { kill, databaseDown, mailDown } with each drill's figures.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));
const DRILLS = { kill: 'kill.drill.ts', databaseDown: 'database-down.drill.ts', mailDown: 'mail-down.drill.ts' } as const;
type Name = keyof typeof DRILLS;

const args = process.argv.slice(2);
const onlyAt = args.indexOf('--only');
const only = onlyAt >= 0 ? args[onlyAt + 1].split(',').map((s) => (s === 'database' || s === 'db' ? 'databaseDown' : s === 'mail' ? 'mailDown' : s)) : null;
const passOn = onlyAt >= 0 ? [...args.slice(0, onlyAt), ...args.slice(onlyAt + 2)] : args;

/** Run one script with tsx, echoing its output; resolves with the JSON of its last line (or an error). */
export function runScript(file: string, argv: string[], env: NodeJS.ProcessEnv = process.env): Promise<{ figures: Record<string, unknown> | null; error: string | null; output: string; seconds: number }> {
  const t0 = performance.now();
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', file, ...argv], { cwd: path.resolve(here, '../..'), env, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (b: Buffer) => { out += b; process.stdout.write(b); });
    child.stderr.on('data', (b: Buffer) => { process.stderr.write(b); });
    child.once('exit', (code, signal) => {
      const seconds = (performance.now() - t0) / 1000;
      const last = out.trim().split('\n').pop() ?? '';
      let figures: Record<string, unknown> | null = null;
      try { figures = JSON.parse(last); } catch { /* not JSON */ }
      const error = code === 0 ? null : `exited with ${code ?? signal}`;
      resolve({ figures: figures && typeof figures === 'object' ? figures : null, error, output: out, seconds });
    });
  });
}

const isMain = process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const all: Record<string, unknown> = {};
  let failed = false;
  for (const name of Object.keys(DRILLS) as Name[]) {
    if (only && !only.includes(name)) continue;
    console.log(`\n=== drill: ${name} ===`);
    const r = await runScript(path.join(here, DRILLS[name]), passOn);
    all[name] = r.figures ?? { error: r.error ?? 'no figures' };
    if (r.error || !r.figures) failed = true;
  }
  console.log(JSON.stringify(all));
  process.exit(failed ? 1 : 0);
}
