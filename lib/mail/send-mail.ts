import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';
import { log } from '@/lib/log';

let transporter: Transporter | undefined;

function transport(): Transporter {
  if (!transporter) {
    const url = new URL(env().SMTP_URL);
    const loopback = ['127.0.0.1', 'localhost', '::1'].includes(url.hostname);
    transporter = nodemailer.createTransport({
      host: url.hostname,
      port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 587)),
      secure: url.protocol === 'smtps:',
      // The local fake speaks plain SMTP on loopback; a real relay negotiates TLS.
      ignoreTLS: loopback,
      auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    });
  }
  return transporter;
}

export type OutgoingMail = { to: string; subject: string; text: string; html?: string };

export async function sendMail(mail: OutgoingMail): Promise<void> {
  const info = await transport().sendMail({ from: env().MAIL_FROM, ...mail });
  log('info', 'mail sent', { subject: mail.subject, messageId: info.messageId });
}
