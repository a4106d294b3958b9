import type { OutboxResponse } from '../../shared/api/bulletins.schema';
import type { AppContext } from '../app-context';

const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null);

/** The delivery log: recent outbox messages with every attempt, and how many are pending, sent and failed. */
export class OutboxService {
  constructor(private readonly ctx: AppContext) {}

  async log(query: { status: 'pending' | 'sent' | 'failed' | 'all'; limit: number }): Promise<OutboxResponse> {
    const [counts] = await this.ctx.ds.query(
      `SELECT count(*) FILTER (WHERE status = 'pending')::int AS pending, count(*) FILTER (WHERE status = 'sent')::int AS sent,
              count(*) FILTER (WHERE status = 'failed')::int AS failed FROM outbox_messages`,
    );
    const rows: any[] = await this.ctx.ds.query(
      `SELECT m.id, m.kind, m.to_address, m.subject, m.status, m.attempts, m.next_attempt_at, m.last_error, m.created_at, m.sent_at,
              coalesce((SELECT json_agg(json_build_object('at', a.at, 'outcome', a.outcome, 'error', a.error, 'durationMs', a.duration_ms) ORDER BY a.at)
                          FROM outbox_attempts a WHERE a.message_id = m.id), '[]') AS log
         FROM outbox_messages m
        WHERE ($1 = 'all' OR m.status = $1)
        ORDER BY (m.status = 'failed') DESC, (m.status = 'pending') DESC, m.created_at DESC
        LIMIT $2`,
      [query.status, query.limit],
    );
    return {
      counts,
      messages: rows.map((r) => ({
        id: r.id,
        kind: r.kind,
        to: r.to_address,
        subject: r.subject,
        status: r.status,
        attempts: r.attempts,
        nextAttemptAt: r.status === 'pending' ? iso(r.next_attempt_at) : null,
        lastError: r.last_error,
        createdAt: iso(r.created_at)!,
        sentAt: iso(r.sent_at),
        log: r.log.map((l: { at: string; outcome: 'sent' | 'retry' | 'failed'; error: string | null; durationMs: number }) => ({ ...l, at: iso(l.at)! })),
      })),
    };
  }
}
