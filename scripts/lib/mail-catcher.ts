import { mkdirSync, rmSync } from 'node:fs';
import { MailDev } from 'maildev';

/**
 * maildev on loopback (it binds every interface unless told), SMTP and web view on the given ports.
 * Mail is kept in the project's own folder: maildev's default (one shared folder under /tmp) breaks
 * when another user or clone created it first. `fresh` empties it (the test run).
 */
export async function startMailCatcher(smtp: number, web: number, mailDirectory: string, opts: { fresh?: boolean } = {}) {
  if (opts.fresh) rmSync(mailDirectory, { recursive: true, force: true });
  mkdirSync(mailDirectory, { recursive: true });
  const maildev = new MailDev({ smtp, web, ip: '127.0.0.1', webIp: '127.0.0.1', silent: true, mailDirectory } as never);
  await maildev.start();
  return maildev;
}
