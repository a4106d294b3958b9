import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { entities } from './entities';
import { migrations } from './migrations';

export function createDataSource(url: string, poolSize = 10): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    synchronize: false,
    // gen_random_uuid() is built into PostgreSQL 13+; no extension to install.
    uuidExtension: 'pgcrypto',
    migrationsTransactionMode: 'each',
    extra: { max: poolSize, connectionTimeoutMillis: 5_000 },
    // TypeORM's own query logging would print parameters (personal data); errors reach pino instead.
    logging: false,
  });
}

/** For the TypeORM CLI (`npm run migration:generate`): reads DATABASE_URL. */
export default createDataSource(process.env.DATABASE_URL ?? 'postgres://broodcast@127.0.0.1:54320/broodcast');
