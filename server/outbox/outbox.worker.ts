import type { AppContext } from '../app-context';
import type { Mailer } from '../mail/mailer';
import { reasonOf } from '../http/problem-reason';
import { OutboxRepository, type SendOutcome } from './outbox.repository';

export type { SendOutcome };

/** An error's text as stored in the delivery log: at most 1,000 characters, without NUL bytes (PostgreSQL text refuses them). */
function errorText(err: unknown): string {
  const text = String((err as Error)?.message ?? '').replaceAll('\u0000', '');
  return text.slice(0, 1000) || 'unknown error';
}

/**
 * Sends the outbox, one message per short transaction:
 *
 *   BEGIN; SELECT … FOR UPDATE SKIP LOCKED (one due row); send over SMTP; mark sent (or set the
 *   back-off) and log the attempt; COMMIT.
 *
 * The row stays locked while it is sent, so any number of workers (in this process or others) never
 * send the same row at once, and a worker that dies releases its row with its connection. The one
 * window left is a death after the SMTP server accepted the mail and before COMMIT: the row is still
 * pending and is sent again, with the same Message-ID, so the copy is recognisably the same message.
 * That is at-least-once delivery with duplicates detectable by Message-ID — the honest best without
 * a transactional mail server (docs/flags-and-bulletins.md).
 */
export class OutboxWorker {
  private readonly mailer: Mailer;
  private stopped = false;

  constructor(private readonly ctx: AppContext, opts: { mailer?: Mailer } = {}) {
    this.mailer = opts.mailer ?? ctx.mailer;
  }

  /** Ask a running drain to stop after the message it is sending (a drill for "the worker died"). */
  stop() {
    this.stopped = true;
  }

  /** Send due messages one by one until none is due, `max` were tried, or stop() was called. */
  async drain(opts: { max?: number } = {}): Promise<Record<SendOutcome, number>> {
    const counts: Record<SendOutcome, number> = { sent: 0, retry: 0, failed: 0 };
    const max = opts.max ?? 1000;
    for (let i = 0; i < max && !this.stopped; i++) {
      const outcome = await this.sendNext();
      if (!outcome) break;
      counts[outcome] += 1;
    }
    return counts;
  }

  /** Claim one due message, send it and record the outcome; null when nothing is due. */
  async sendNext(): Promise<SendOutcome | null> {
    const { config } = this.ctx;
    const runner = this.ctx.ds.createQueryRunner();
    await runner.connect();
    let claimed: string | null = null;
    try {
      await runner.startTransaction();
      const outbox = new OutboxRepository(runner.manager);
      const row = await outbox.claimNext();
      if (!row) {
        await runner.commitTransaction();
        return null;
      }
      claimed = row.id;
      const started = Date.now();
      let error: string | null = null;
      let permanent = false;
      try {
        await this.mailer.send({
          to: row.to_address,
          subject: row.subject,
          text: row.text_body,
          html: row.html_body,
          messageId: row.message_id,
          headers: row.headers,
          attachments: row.pdf ? [{ filename: row.pdf_name!, content: row.pdf, contentType: 'application/pdf' }] : undefined,
        });
      } catch (err) {
        error = errorText(err);
        // The mail server refused this message for good (an SMTP 5xx answer, e.g. an unknown mailbox):
        // trying again cannot help, so it fails now and the drain goes on with the others.
        const responseCode = (err as { responseCode?: unknown }).responseCode;
        if (typeof responseCode === 'number' && responseCode >= 500 && responseCode < 600) permanent = true;
      }
      const attempts = row.attempts + 1;
      const outcome: SendOutcome = error === null ? 'sent' : permanent || attempts >= config.OUTBOX_MAX_ATTEMPTS ? 'failed' : 'retry';
      const backoff = Math.min(config.OUTBOX_BACKOFF_SECONDS * 2 ** (attempts - 1), config.OUTBOX_BACKOFF_MAX_SECONDS);
      await outbox.recordAttempt(row.id, { attempts, error, outcome, backoffSeconds: backoff, durationMs: Date.now() - started });
      await runner.commitTransaction();
      if (outcome !== 'sent') this.ctx.logger.warn({ message: row.id, kind: row.kind, attempts, err: error }, `mail ${outcome === 'failed' ? 'failed for good' : 'will be retried'}`);
      return outcome;
    } catch (err) {
      if (runner.isTransactionActive) await runner.rollbackTransaction().catch(() => undefined);
      if (!claimed) throw err;
      // Recording this one message's outcome failed (its data broke the write): mark it failed on its
      // own so that it is not claimed first again and again, blocking every message behind it.
      await this.markBroken(claimed, err);
      return 'failed';
    } finally {
      await runner.release();
    }
  }

  /** Mark one message failed after its own outcome could not be recorded, with a code as its error. */
  private async markBroken(id: string, err: unknown) {
    const code = `not_recorded: ${reasonOf(err).code}`;
    await new OutboxRepository(this.ctx.ds.manager).markBroken(id, code);
    this.ctx.logger.error({ message: id, err: (err as Error)?.message }, 'mail failed for good: its outcome could not be recorded; the others go on');
  }
}
