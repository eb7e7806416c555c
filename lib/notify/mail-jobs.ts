import { renderMail, type MailContent } from './render-mail';

// Mail goes through the outbox (topic 'mail.send'), one job per recipient, so a down SMTP relay only delays it.

export const MAIL_TOPIC = 'mail.send';

export type Recipient = { email: string; name: string };
export type MailPayload = { to: string; subject: string; text: string; html: string; kind: string };
export type MailJob = { topic: typeof MAIL_TOPIC; aggregateId: string; payload: MailPayload; holdMs?: number };

/** One 'mail.send' job per distinct address (case-insensitive), the message rendered once. */
export function mailJobs(recipients: Recipient[], content: MailContent, options: { aggregateId: string; kind: string; holdMs?: number }): MailJob[] {
  const rendered = renderMail(content);
  const seen = new Set<string>();
  const jobs: MailJob[] = [];
  for (const r of recipients) {
    const key = r.email.trim().toLowerCase();
    if (!key || seen.has(key)) continue;
    seen.add(key);
    jobs.push({
      topic: MAIL_TOPIC, aggregateId: options.aggregateId, holdMs: options.holdMs,
      payload: { to: r.email.trim(), subject: rendered.subject, text: rendered.text, html: rendered.html, kind: options.kind },
    });
  }
  return jobs;
}

export function isMailPayload(p: unknown): p is MailPayload {
  const o = p as Record<string, unknown> | null;
  return !!o && ['to', 'subject', 'text', 'html'].every((k) => typeof o[k] === 'string');
}
