import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDatabase, startCluster } from './cluster';
import { ports } from './ports';
import { loadLocalSecrets } from './secrets';

export const projectDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/**
 * Start the dev cluster (or share it when it already runs) and make sure the app's role and database
 * exist. `BROODCAST_CLUSTER` (dev, or test to run against a running test cluster) and
 * `BROODCAST_DATABASE` (the database and role name) exist for the start script's own tests.
 */
export async function startDevDatabase() {
  const secrets = loadLocalSecrets(projectDir, 'dev');
  const name = process.env.BROODCAST_CLUSTER === 'test' ? 'test' : 'dev';
  const cluster = await startCluster({ projectDir, name, port: ports.pg, durable: name === 'dev' });
  const db = process.env.BROODCAST_DATABASE ?? 'broodcast';
  const url = await ensureDatabase(cluster, { name: db, user: db, password: secrets.databasePassword });
  return { cluster, url, secrets };
}
