import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';
import { EmailMessage } from '@/models';

// One SMTP transport per process. Locally it points at the SMTP fake that
// `npm start` runs; SMTP_HOST/PORT/USER/PASSWORD point it at a real host.
let transport: Transporter | undefined;
function smtp(): Transporter {
  transport ??= nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? '' } : undefined,
    connectionTimeout: 10_000,
  });
  return transport;
}

export type OutgoingEmail = { studioId: string | null; kind: string; to: string; subject: string; text: string; html?: string };

/**
 * Sends an e-mail and records it (EmailMessage) whatever happens, so admins can
 * see what went out and what failed. Never throws for an SMTP failure: the
 * returned record says `failed` with the reason.
 */
export async function sendEmail(message: OutgoingEmail): Promise<EmailMessage> {
  const record = await EmailMessage.create({
    studioId: message.studioId,
    kind: message.kind,
    toAddress: message.to,
    subject: message.subject,
    textBody: message.text,
    status: 'sending',
    error: null,
    providerMessageId: null,
  });
  try {
    const info = await smtp().sendMail({ from: env.MAIL_FROM, to: message.to, subject: message.subject, text: message.text, html: message.html });
    await record.update({ status: 'sent', providerMessageId: info.messageId ?? null });
  } catch (error) {
    await record.update({ status: 'failed', error: (error as Error).message.slice(0, 2000) });
  }
  return record;
}
