// Reads what the SMTP fake kept in MAIL_DIR (one .json per message, names sortable by arrival).
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { StoredMail } from '@/scripts/fakes/mail-store';

export type { StoredMail };

/** All kept messages, oldest first. */
export async function readMailbox(dir = process.env.MAIL_DIR): Promise<StoredMail[]> {
  if (!dir) throw new Error('MAIL_DIR is not set. Run the tests through `npm test`, which starts the SMTP fake.');
  let names: string[];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json') && !n.startsWith('.'));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  names.sort();
  return Promise.all(names.map(async (n) => JSON.parse(await readFile(path.join(dir, n), 'utf8')) as StoredMail));
}

export type MailQuery = {
  to: string;
  subject?: string | RegExp;
  /** Only messages received at or after this time (skip mail from earlier tests). */
  since?: Date;
  timeoutMs?: number;
  dir?: string;
};

function matches(m: StoredMail, q: MailQuery): boolean {
  const to = q.to.toLowerCase();
  if (!m.to.some((a) => a.toLowerCase() === to) && !m.headerTo.some((a) => a.toLowerCase() === to)) return false;
  if (q.since && new Date(m.date) < q.since) return false;
  if (q.subject === undefined) return true;
  return typeof q.subject === 'string' ? m.subject === q.subject : q.subject.test(m.subject);
}

/** Polls the mailbox until a message matches; newest match wins. Fails listing what did arrive. */
export async function waitForMail(q: MailQuery): Promise<StoredMail> {
  const until = Date.now() + (q.timeoutMs ?? 10_000);
  let seen: StoredMail[] = [];
  for (;;) {
    seen = await readMailbox(q.dir);
    const hit = seen.filter((m) => matches(m, q)).at(-1);
    if (hit) return hit;
    if (Date.now() > until) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  const got = seen.slice(-10).map((m) => `  ${m.date} to=${m.to.join(',')} subject=${JSON.stringify(m.subject)}`).join('\n');
  throw new Error(`No mail to ${q.to}${q.subject ? ` with subject ${String(q.subject)}` : ''} within ${q.timeoutMs ?? 10_000} ms. Latest messages:\n${got || '  (none)'}`);
}
