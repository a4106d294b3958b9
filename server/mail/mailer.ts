import nodemailer from 'nodemailer';
import type { Config } from '../config';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
  /** A stable Message-ID (the outbox gives each message one, so a re-send is recognisably the same). */
  messageId?: string;
  headers?: Record<string, string>;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

/** nodemailer over SMTP; locally the SMTP server is the maildev mail catcher. */
export function createMailer(config: Config): Mailer {
  const transport = nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: false,
    ignoreTLS: config.NODE_ENV !== 'production',
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
  });
  return {
    async send(message) {
      await transport.sendMail({ from: config.MAIL_FROM, ...message });
    },
    close: () => transport.close(),
  };
}
