import { createDataSource } from '../../server/db/data-source';
import { seedDemoIfEmpty } from '../../sample/seed-demo';

/** Run the reviewed migrations (under tsx, which also proves the entities load without decorator metadata). */
export async function migrate(url: string, opts: { seedDemo?: { nodeEnv: string; bcryptCost: number } } = {}) {
  const ds = createDataSource(url, 2);
  await ds.initialize();
  try {
    const ran = await ds.runMigrations({ transaction: 'each' });
    let seeded = false;
    if (opts.seedDemo) seeded = await seedDemoIfEmpty(ds, opts.seedDemo);
    return { migrations: ran.map((m) => m.name), seeded };
  } finally {
    await ds.destroy();
  }
}
