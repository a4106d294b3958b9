import { createHash, randomBytes } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { IsNull, MoreThan } from 'typeorm';
import { OneTimeTokenEntity, type TokenPurpose } from './one-time-token.entity';

const sha256 = (token: string) => createHash('sha256').update(token).digest('hex');

/** A new one-time token and the hash that is stored of it (the plain token goes only in the link). */
export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: sha256(token) };
}

/** Issue a one-time token; the plain token goes in the e-mail link, only its hash is stored. */
export async function issueToken(manager: EntityManager, userId: string, purpose: TokenPurpose, ttlHours: number) {
  const token = randomBytes(32).toString('base64url');
  await manager.insert(OneTimeTokenEntity, {
    userId,
    purpose,
    tokenHash: sha256(token),
    expiresAt: new Date(Date.now() + ttlHours * 3_600_000),
  });
  return token;
}

/** Take a live token once: marks it used in the caller's transaction, or returns null. */
export async function consumeToken(manager: EntityManager, token: string, purpose: TokenPurpose) {
  const row = await manager.findOne(OneTimeTokenEntity, {
    where: { tokenHash: sha256(token), purpose, usedAt: IsNull(), expiresAt: MoreThan(new Date()) },
    lock: { mode: 'pessimistic_write' },
  });
  if (!row) return null;
  await manager.update(OneTimeTokenEntity, { id: row.id }, { usedAt: new Date() });
  return row;
}
