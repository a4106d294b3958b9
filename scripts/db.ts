/**
 * Developer helper: `npx tsx scripts/db.ts url` starts the dev cluster and prints DATABASE_URL
 * (for `DATABASE_URL=$(npx tsx scripts/db.ts url) npm run migration:generate -- …`);
 * `npx tsx scripts/db.ts stop` stops it.
 */
import { stopCluster } from './lib/cluster';
import { startDevDatabase } from './lib/dev-database';

const cmd = process.argv[2];
const { cluster, url } = await startDevDatabase();
if (cmd === 'stop') stopCluster(cluster);
else process.stdout.write(url + '\n');
