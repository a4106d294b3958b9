import { createDataSource } from '../../server/db/data-source';
import { seedDemoIfEmpty } from '../../sample/seed-demo';
import { firstAdminLink } from '../../server/setup/first-admin';

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

/** An installation without the demo: the first admin's one-time link while no admin has a password (server/setup/first-admin.ts). */
export async function firstAdmin(url: string, opts: { appUrl: string; email?: string }) {
  const ds = createDataSource(url, 2);
  await ds.initialize();
  try {
    return await firstAdminLink(ds, opts);
  } finally {
    await ds.destroy();
  }
}
