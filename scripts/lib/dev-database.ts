import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDatabase, startCluster } from './cluster';
import { ports } from './ports';
import { loadLocalSecrets } from './secrets';

export const projectDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** Start the dev cluster and make sure the app's role and database exist. */
export async function startDevDatabase() {
  const secrets = loadLocalSecrets(projectDir, 'dev');
  const cluster = await startCluster({ projectDir, name: 'dev', port: ports.pg, durable: true });
  const url = await ensureDatabase(cluster, { name: 'broodcast', user: 'broodcast', password: secrets.databasePassword });
  return { cluster, url, secrets };
}
