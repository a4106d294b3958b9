import { MailDev } from 'maildev';

/** maildev on loopback (it binds every interface unless told), SMTP and web view on the given ports. */
export async function startMailCatcher(smtp: number, web: number) {
  const maildev = new MailDev({ smtp, web, ip: '127.0.0.1', webIp: '127.0.0.1', silent: true } as never);
  await maildev.start();
  return maildev;
}
