import { randomUUID } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { z } from 'zod';
import { OUTBOX_STATUSES } from '../../shared/api/bulletins.schema';
import { parseFirst, parseRows, timestampColumn } from '../platform/rows';
import type { Config } from '../config';
import { OutboxMessageEntity, type OutboxKind } from './outbox-message.entity';

export interface OutgoingMail {
  kind: OutboxKind;
  to: string;
  userId?: string | null;
  subject: string;
  text: string;
  html: string;
  headers?: Record<string, string>;
  bulletinId?: string | null;
  digestId?: string | null;
  advisoryId?: string | null;
}

/** The domain of MAIL_FROM (`Broodcast <no-reply@x.example>` → x.example), for Message-IDs. */
export function mailDomain(config: Config): string {
  return /@([A-Za-z0-9.-]+)>?\s*$/.exec(config.MAIL_FROM)?.[1] ?? 'broodcast.invalid';
}

/**
 * Queue mail with the caller's transaction manager, so a message exists if and only if what caused it
 * (an advisory, a bulletin) was committed. Each gets its stable Message-ID here, once.
 */
export async function enqueueMail(manager: EntityManager, config: Config, mails: OutgoingMail[]): Promise<number> {
  if (mails.length === 0) return 0;
  const domain = mailDomain(config);
  const rows = mails.map((m) => {
    const id = randomUUID();
    return {
      id,
      kind: m.kind,
      messageId: `<${id}@${domain}>`,
      toAddress: m.to,
      userId: m.userId ?? null,
      subject: m.subject,
      textBody: m.text,
      htmlBody: m.html,
      headers: m.headers ?? {},
      bulletinId: m.bulletinId ?? null,
      digestId: m.digestId ?? null,
      advisoryId: m.advisoryId ?? null,
    };
  });
  // Batches keep each INSERT well under PostgreSQL's limit of 65,535 parameters.
  for (let i = 0; i < rows.length; i += 500) await manager.insert(OutboxMessageEntity, rows.slice(i, i + 500));
  return rows.length;
}

const OUTBOX_KINDS = ['advisory', 'bulletin', 'invite', 'password-reset', 'field-week'] as const satisfies readonly OutboxKind[];
const SEND_OUTCOMES = ['sent', 'retry', 'failed'] as const;
export type SendOutcome = (typeof SEND_OUTCOMES)[number];

const countsRow = z.object({ pending: z.number().int(), sent: z.number().int(), failed: z.number().int() });
const logRow = z.object({
  id: z.string(),
  kind: z.enum(OUTBOX_KINDS),
  to_address: z.string(),
  subject: z.string(),
  status: z.enum(OUTBOX_STATUSES),
  attempts: z.number().int(),
  next_attempt_at: timestampColumn,
  last_error: z.string().nullable(),
  created_at: timestampColumn,
  sent_at: timestampColumn.nullable(),
  log: z.array(z.object({ at: z.string(), outcome: z.enum(SEND_OUTCOMES), error: z.string().nullable(), durationMs: z.number().int() })),
});
export type OutboxLogRow = z.infer<typeof logRow>;

const claimedRow = z.object({
  id: z.string(),
  kind: z.enum(OUTBOX_KINDS),
  message_id: z.string(),
  to_address: z.string(),
  subject: z.string(),
  text_body: z.string(),
  html_body: z.string(),
  headers: z.record(z.string(), z.string()),
  attempts: z.number().int(),
  pdf: z.instanceof(Buffer).nullable(),
  pdf_name: z.string().nullable(),
});
export type ClaimedMessage = z.infer<typeof claimedRow>;

/** All SQL of the outbox's delivery log and of its worker. */
export class OutboxRepository {
  constructor(private readonly manager: EntityManager) {}

  async counts(): Promise<z.infer<typeof countsRow>> {
    return parseRows(countsRow, await this.manager.query(
      `SELECT count(*) FILTER (WHERE status = 'pending')::int AS pending, count(*) FILTER (WHERE status = 'sent')::int AS sent,
              count(*) FILTER (WHERE status = 'failed')::int AS failed FROM outbox_messages`,
    ))[0]!;
  }

  /** Recent messages with every attempt, failed first, then pending, then newest. */
  async log(status: 'pending' | 'sent' | 'failed' | 'all', limit: number): Promise<OutboxLogRow[]> {
    return parseRows(logRow, await this.manager.query(
      `SELECT m.id, m.kind, m.to_address, m.subject, m.status, m.attempts, m.next_attempt_at, m.last_error, m.created_at, m.sent_at,
              coalesce((SELECT json_agg(json_build_object('at', a.at, 'outcome', a.outcome, 'error', a.error, 'durationMs', a.duration_ms) ORDER BY a.at)
                          FROM outbox_attempts a WHERE a.message_id = m.id), '[]') AS log
         FROM outbox_messages m
        WHERE ($1 = 'all' OR m.status = $1)
        ORDER BY (m.status = 'failed') DESC, (m.status = 'pending') DESC, m.created_at DESC
        LIMIT $2`,
      [status, limit],
    ));
  }

  /**
   * Claim one due message in the caller's transaction (FOR UPDATE SKIP LOCKED), with its PDF: a person's
   * digest carries its own named PDF; a bulletin's PDF is taken in the mail's Content-Language, else the
   * default one.
   */
  async claimNext(): Promise<ClaimedMessage | null> {
    return parseFirst(claimedRow, await this.manager.query(
      `SELECT m.id, m.kind, m.message_id, m.to_address, m.subject, m.text_body, m.html_body, m.headers, m.attempts,
              COALESCE(g.pdf, bt.pdf, b.pdf) AS pdf,
              CASE WHEN g.id IS NOT NULL THEN g.pdf_name WHEN b.id IS NULL THEN NULL
                   ELSE 'broodcast-bulletin-' || d.code || '-' || b.epi_year || '-w' || lpad(b.epi_week::text, 2, '0') || '.pdf' END AS pdf_name
         FROM outbox_messages m
         -- a person's weekly digest carries its own named PDF
         LEFT JOIN bulletin_digests g ON g.id = m.digest_id
         LEFT JOIN bulletins b ON b.id = m.bulletin_id
         -- the PDF in the language the mail is written in (its Content-Language), else the default one
         LEFT JOIN bulletin_translations bt ON bt.bulletin_id = b.id AND bt.language = m.headers->>'Content-Language'
         LEFT JOIN districts d ON d.id = b.district_id
        WHERE m.status = 'pending' AND m.next_attempt_at <= now()
        ORDER BY m.next_attempt_at, m.created_at
        LIMIT 1
        FOR UPDATE OF m SKIP LOCKED`,
    ));
  }

  /** Store one attempt's outcome on the message and in the attempt log. */
  async recordAttempt(id: string, a: { attempts: number; error: string | null; outcome: SendOutcome; backoffSeconds: number; durationMs: number }): Promise<void> {
    await this.manager.query(
      `UPDATE outbox_messages
          SET attempts = $2, last_error = $3,
              status = CASE $4 WHEN 'sent' THEN 'sent' WHEN 'failed' THEN 'failed' ELSE 'pending' END,
              sent_at = CASE WHEN $4 = 'sent' THEN now() ELSE NULL END,
              next_attempt_at = CASE WHEN $4 = 'retry' THEN now() + make_interval(secs => $5) ELSE next_attempt_at END
        WHERE id = $1`,
      [id, a.attempts, a.error, a.outcome, a.backoffSeconds],
    );
    await this.manager.query(
      `INSERT INTO outbox_attempts (message_id, outcome, error, duration_ms) VALUES ($1, $2, $3, $4)`,
      [id, a.outcome, a.error, a.durationMs],
    );
  }

  /** Mark one pending message failed with a code as its error (its own outcome could not be recorded). */
  async markBroken(id: string, code: string): Promise<void> {
    await this.manager.query(
      `UPDATE outbox_messages SET attempts = attempts + 1, status = 'failed', last_error = $2 WHERE id = $1 AND status = 'pending'`,
      [id, code],
    );
    await this.manager.query(`INSERT INTO outbox_attempts (message_id, outcome, error, duration_ms) VALUES ($1, 'failed', $2, 0)`, [id, code]);
  }
}
