import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';

/** A stable 64-bit key per job name for pg_try_advisory_lock. */
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
    const [{ locked }] = await runner.query('SELECT pg_try_advisory_lock($1::bigint) AS locked', [lockKey(name)]);
    if (!locked) return { ran: false };
    try {
      return { ran: true, result: await fn() };
    } finally {
      await runner.query('SELECT pg_advisory_unlock($1::bigint)', [lockKey(name)]);
    }
  } finally {
    await runner.release();
  }
}
