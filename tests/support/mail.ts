/** Read what the test mail catcher (maildev) received, through its REST API. */
const base = () => `http://127.0.0.1:${process.env.TEST_MAIL_WEB_PORT ?? '1081'}`;

export interface CaughtMail {
  id: string;
  subject: string;
  to: { address: string }[];
  text: string;
  html: string;
  attachments?: { generatedFileName: string; contentType: string; fileName: string }[];
}

export async function mailsTo(address: string): Promise<CaughtMail[]> {
  const res = await fetch(`${base()}/api/email`, { headers: { accept: 'application/json' } });
  const all = (await res.json()) as CaughtMail[]; // always read the body: maildev waits for it
  return all.filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()));
}

/** Wait until a mail to the address arrives (SMTP delivery is asynchronous). */
export async function waitForMail(address: string, timeoutMs = 5_000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const found = await mailsTo(address);
    if (found.length) return found[found.length - 1];
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${address} within ${timeoutMs} ms`);
}

export const linkToken = (mail: CaughtMail) => /token=([A-Za-z0-9_-]+)/.exec(mail.text)?.[1] ?? null;
