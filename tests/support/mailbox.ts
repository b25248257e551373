import { env } from '@/lib/env';

type FakeMail = { id: string; subject: string; text: string; to: { address: string }[] };

/** Reads messages from the SMTP fake's REST API (maildev: GET /api/email). */
export async function messagesTo(address: string): Promise<FakeMail[]> {
  if (!env.SKYWELL_MAIL_FAKE_URL) throw new Error('SKYWELL_MAIL_FAKE_URL is not set: run through npm test, which starts the SMTP fake');
  const response = await fetch(`${env.SKYWELL_MAIL_FAKE_URL}/api/email`);
  const all = (await response.json()) as FakeMail[];
  return all.filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()));
}

/** Waits for the first message to an address; the SMTP hand-off is asynchronous. */
export async function waitForMessageTo(address: string, timeoutMs = 10_000): Promise<FakeMail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const [message] = await messagesTo(address);
    if (message) return message;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no e-mail to ${address} reached the SMTP fake within ${timeoutMs} ms`);
}

export function invitationLinkIn(text: string): string {
  const match = text.match(/https?:\/\/\S+\/invitations\/[A-Za-z0-9_-]+/);
  if (!match) throw new Error(`no invitation link in the e-mail:\n${text}`);
  return match[0];
}
