import { mkdirSync, readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The checkout's own `.local/uploads` (git-ignored), not the OS temp folder every instance of the user shares. */
export const DEFAULT_UPLOAD_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..', '.local', 'uploads');

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
};

/**
 * Remove the upload folders of processes that are gone (`<root>/<pid>`): the files a killed intake
 * left behind. Folders of running processes (another server of this checkout, a test worker) stay.
 * Returns the folders removed.
 */
export function sweepUploadFolders(root = DEFAULT_UPLOAD_ROOT): string[] {
  let names: string[];
  try {
    names = readdirSync(root);
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const name of names) {
    const pid = Number(name);
    if (!/^\d+$/.test(name) || pid === process.pid || alive(pid)) continue;
    rmSync(path.join(root, name), { recursive: true, force: true });
    removed.push(name);
  }
  return removed;
}

/**
 * Where this process keeps uploads while they are checked: WEATHER_UPLOAD_DIR when set (used as it is),
 * else `.local/uploads/<pid>` — its own folder, so a sweep at start can tell a dead process's leftovers
 * from a live one's files. The sweep runs here, once per process.
 */
export function uploadFolder(configured: string | undefined): string {
  if (configured) {
    mkdirSync(configured, { recursive: true, mode: 0o700 });
    return configured;
  }
  sweepUploadFolders();
  const dir = path.join(DEFAULT_UPLOAD_ROOT, String(process.pid));
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  return dir;
}
