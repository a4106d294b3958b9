import type { EntityManager } from 'typeorm';
import { z } from 'zod';
import { parseRows } from '../platform/rows';

/** The SQL of PostgreSQL advisory locks; keys come from `lockKey` in ./locks.ts. */
export class LocksRepository {
  constructor(private readonly manager: EntityManager) {}

  /** A session-level lock, taken only if free; the manager must be bound to one connection (a query runner). */
  async trySessionLock(key: string): Promise<boolean> {
    const [row] = parseRows(z.object({ locked: z.boolean() }), await this.manager.query('SELECT pg_try_advisory_lock($1::bigint) AS locked', [key]));
    return row?.locked === true;
  }

  async sessionUnlock(key: string): Promise<void> {
    await this.manager.query('SELECT pg_advisory_unlock($1::bigint)', [key]);
  }

  /** A transaction-level lock, waited for, released at COMMIT or ROLLBACK of the manager's transaction. */
  async transactionLock(key: string): Promise<void> {
    await this.manager.query('SELECT pg_advisory_xact_lock($1::bigint)', [key]);
  }
}
