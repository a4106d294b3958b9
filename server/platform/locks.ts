import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { LocksRepository } from './locks.repository';

/**
 * Database locks, one key scheme for all of Broodcast: a name (`season-run`, `first-admin`, …) becomes a
 * stable signed 64-bit key, the first 8 bytes of sha256("broodcast:" + name), for PostgreSQL's advisory
 * locks. Two kinds:
 * - `withAdvisoryLock`: a job that runs only if no other process runs it (session lock, try, never waits);
 * - `transactionLock`: one writer at a time inside a transaction (waits; released at COMMIT/ROLLBACK).
 *
 * Not yet on this scheme (issue 15 item 5, moves next): the weather intake's own
 * `hashtext('broodcast.weather-intake')` lock in server/weather/weather-intake.service.ts.
 */
export function lockKey(name: string): string {
  return BigInt.asIntN(64, BigInt('0x' + createHash('sha256').update(`broodcast:${name}`).digest('hex').slice(0, 16))).toString();
}

/**
 * Run `fn` only if no other process holds the job's lock (a PostgreSQL session-level advisory lock
 * on one pooled connection, released when done or when the connection dies). Returns whether it ran.
 */
export async function withAdvisoryLock<T>(ds: DataSource, name: string, fn: () => Promise<T>): Promise<{ ran: boolean; result?: T }> {
  const runner = ds.createQueryRunner();
  await runner.connect();
  try {
    const locks = new LocksRepository(runner.manager);
    if (!(await locks.trySessionLock(lockKey(name)))) return { ran: false };
    try {
      return { ran: true, result: await fn() };
    } finally {
      await locks.sessionUnlock(lockKey(name));
    }
  } finally {
    await runner.release();
  }
}

/** Wait for the named lock inside the caller's transaction; it is held until that transaction ends. */
export async function transactionLock(manager: EntityManager, name: string): Promise<void> {
  await new LocksRepository(manager).transactionLock(lockKey(name));
}
