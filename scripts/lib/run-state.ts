/**
 * What a running `npm start` has started, in `.local/run/start-<app port>.json`, so that the next start
 * after a crash (the start script killed with SIGKILL, the machine's terminal closed) can clean up:
 * stop the server it left running (which would hold the port: EADDRINUSE) and take over the cluster it
 * had started. A run file whose start process is still alive means another start is running.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, readlinkSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export interface RunState {
  startPid: number;
  serverPid: number | null;
  appPort: number;
  cluster: { dataDir: string; startedHere: boolean };
}

const runDir = (projectDir: string) => path.join(projectDir, '.local', 'run');
export const runFile = (projectDir: string, appPort: number) => path.join(runDir(projectDir), `start-${appPort}.json`);

export function isAlive(pid: number | null | undefined): boolean {
  if (!pid) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Whether `pid` is a Broodcast server of this checkout (its command line and folder), not a process that reused the id. */
export function isOurServer(pid: number, projectDir: string): boolean {
  try {
    const cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
    const cwd = readlinkSync(`/proc/${pid}/cwd`);
    return cmd.includes('server/main.ts') && path.resolve(cwd) === path.resolve(projectDir);
  } catch {
    return false;
  }
}

export function readRunState(projectDir: string, appPort: number): RunState | null {
  try {
    return JSON.parse(readFileSync(runFile(projectDir, appPort), 'utf8')) as RunState;
  } catch {
    return null;
  }
}

export function writeRunState(projectDir: string, state: RunState): void {
  mkdirSync(runDir(projectDir), { recursive: true });
  writeFileSync(runFile(projectDir, state.appPort), JSON.stringify(state, null, 2));
}

export function removeRunState(projectDir: string, appPort: number): void {
  rmSync(runFile(projectDir, appPort), { force: true });
}

/** Another live start (not this process) that uses the cluster in `dataDir`. */
export function otherStartUsing(projectDir: string, dataDir: string): RunState | null {
  if (!existsSync(runDir(projectDir))) return null;
  for (const name of readdirSync(runDir(projectDir))) {
    if (!/^start-\d+\.json$/.test(name)) continue;
    try {
      const s = JSON.parse(readFileSync(path.join(runDir(projectDir), name), 'utf8')) as RunState;
      if (s.startPid !== process.pid && isAlive(s.startPid) && s.cluster.dataDir === dataDir) return s;
    } catch {
      /* a file being written: ignore */
    }
  }
  return null;
}

/** Stop a process and wait until it is gone: SIGTERM, then SIGKILL after `graceMs`. */
export async function stopProcess(pid: number, graceMs = 10_000): Promise<void> {
  if (!isAlive(pid)) return;
  try {
    process.kill(pid, 'SIGTERM');
  } catch {
    return;
  }
  const until = Date.now() + graceMs;
  while (isAlive(pid) && Date.now() < until) await new Promise((r) => setTimeout(r, 100));
  if (isAlive(pid)) {
    try {
      process.kill(pid, 'SIGKILL');
    } catch {
      /* gone */
    }
    while (isAlive(pid)) await new Promise((r) => setTimeout(r, 50));
  }
}
