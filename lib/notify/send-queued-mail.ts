import 'server-only';
import nodemailer from 'nodemailer';
import { env } from '@/lib/env';
import { sendMail } from '@/lib/mail/send-mail';
import { isMailPayload } from './mail-jobs';

export type MailTransportOptions = {
  /** Another SMTP relay than SMTP_URL (e.g. a closed port in tests); plain SMTP on loopback. */
  smtpUrl?: string;
  timeoutMs?: number;
};

async function sendThrough(smtpUrl: string, timeoutMs: number, mail: { to: string; subject: string; text: string; html: string }): Promise<void> {
  const url = new URL(smtpUrl);
  const transport = nodemailer.createTransport({
    host: url.hostname, port: Number(url.port || 25), secure: url.protocol === 'smtps:', ignoreTLS: url.protocol !== 'smtps:',
    connectionTimeout: timeoutMs, greetingTimeout: timeoutMs, socketTimeout: timeoutMs,
  });
  try {
    await transport.sendMail({ from: env().MAIL_FROM, ...mail });
  } finally {
    transport.close();
  }
}

/** The outbox handler for 'mail.send': delivers one rendered message; a throw makes the outbox retry later. */
export async function sendQueuedMail(payload: unknown, options: MailTransportOptions = {}): Promise<void> {
  if (!isMailPayload(payload)) throw new Error('mail.send payload needs to, subject, text and html');
  const { to, subject, text, html } = payload;
  if (options.smtpUrl) await sendThrough(options.smtpUrl, options.timeoutMs ?? 10_000, { to, subject, text, html });
  else await sendMail({ to, subject, text, html });
}
