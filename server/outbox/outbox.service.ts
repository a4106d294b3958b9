import type { OutboxResponse } from '../../shared/api/bulletins.schema';
import type { AppContext } from '../app-context';
import { OutboxRepository } from './outbox.repository';

const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null);

/** The delivery log: recent outbox messages with every attempt, and how many are pending, sent and failed. */
export class OutboxService {
  constructor(private readonly ctx: AppContext) {}

  async log(query: { status: 'pending' | 'sent' | 'failed' | 'all'; limit: number }): Promise<OutboxResponse> {
    const outbox = new OutboxRepository(this.ctx.ds.manager);
    const counts = await outbox.counts();
    const rows = await outbox.log(query.status, query.limit);
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
        log: r.log.map((l) => ({ ...l, at: iso(l.at)! })),
      })),
    };
  }
}
