/**
 * Developer helper for the dev cluster (started if needed):
 *   npx tsx scripts/db.ts url [name]      print the DATABASE_URL of database `name` (default broodcast), creating it
 *   npx tsx scripts/db.ts migrate [name]  run the reviewed migrations into it, then print its URL
 *   npx tsx scripts/db.ts stop            stop the dev cluster
 * e.g. `DATABASE_URL=$(npx tsx scripts/db.ts migrate broodcast_gen_x) npm run migration:generate -- …`
 */
import { ensureDatabase, stopCluster } from './lib/cluster';
import { startDevDatabase } from './lib/dev-database';
import { migrate } from './lib/prepare-database';

const [cmd = 'url', name] = process.argv.slice(2);
const { cluster, url, secrets } = await startDevDatabase();
if (cmd === 'stop') {
  stopCluster(cluster);
} else {
  const target = name ? await ensureDatabase(cluster, { name, user: 'broodcast', password: secrets.databasePassword }) : url;
  if (cmd === 'migrate') await migrate(target);
  process.stdout.write(target + '\n');
}
