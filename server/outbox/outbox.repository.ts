import { randomUUID } from 'node:crypto';
import type { EntityManager } from 'typeorm';
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
