import { randomUUID } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import type { Config } from '../config';
import { mailDomain } from '../outbox/outbox.repository';

export interface ResetRequestRow {
  /** The account the link is for; null for an address with no usable account. */
  userId: string | null;
  to: string;
  tokenHash: string;
  ttlHours: number;
  mail: { subject: string; text: string; html: string; headers: Record<string, string> };
}

/**
 * Record a password-reset request in the caller's transaction with one statement that does the same
 * work whatever the address: it inserts the one-time token and the reset mail into the outbox when
 * there is an account, and the same INSERTs select no row when there is none. The request then takes
 * the same path (and the same time) either way, so its answer and its timing say nothing about which
 * addresses have accounts (ASVS V6.4 / no account enumeration). Hand-written SQL rather than
 * `enqueueMail`, because TypeORM's insert cannot be told to insert nothing in one round trip.
 * Returns the rows written (0 or 1 mail).
 */
export async function recordResetRequest(manager: EntityManager, config: Config, r: ResetRequestRow): Promise<number> {
  const id = randomUUID();
  const rows: { mails: number }[] = await manager.query(
    `WITH known AS (SELECT $1::uuid AS user_id WHERE $1::uuid IS NOT NULL),
          token AS (
            INSERT INTO one_time_tokens (user_id, purpose, token_hash, expires_at)
            SELECT user_id, 'password-reset', $2, now() + make_interval(hours => $3) FROM known
            RETURNING id),
          mail AS (
            INSERT INTO outbox_messages (id, kind, message_id, to_address, user_id, subject, text_body, html_body, headers)
            SELECT $4::uuid, 'password-reset', $5, $6, user_id, $7, $8, $9, $10::jsonb FROM known
            RETURNING id)
     SELECT (SELECT count(*) FROM mail)::int AS mails`, // PostgreSQL runs both INSERTs whether or not they are read
    [r.userId, r.tokenHash, r.ttlHours, id, `<${id}@${mailDomain(config)}>`, r.to, r.mail.subject, r.mail.text, r.mail.html, JSON.stringify(r.mail.headers)],
  );
  return rows[0]?.mails ?? 0;
}
