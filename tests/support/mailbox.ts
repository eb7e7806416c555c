import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';

// Reads what the local SMTP fake kept (scripts/fakes/mail-store.ts writes one .json per message).
export type KeptMail = { id: string; date: string; from: string; to: string[]; subject: string; text: string; links: string[] };

export async function readMailbox(dir = process.env.MAIL_DIR): Promise<KeptMail[]> {
  if (!dir) throw new Error('MAIL_DIR is not set: run the tests through npm test.');
  let names: string[] = [];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json') && !n.startsWith('.'));
  } catch {
    return [];
  }
  return Promise.all(names.sort().map(async (n) => JSON.parse(await readFile(path.join(dir, n), 'utf8')) as KeptMail));
}

export async function waitForMail(opts: { to: string; subject?: string | RegExp; timeoutMs?: number; dir?: string }): Promise<KeptMail> {
  const deadline = Date.now() + (opts.timeoutMs ?? 10_000);
  const wanted = opts.to.toLowerCase();
  for (;;) {
    const found = (await readMailbox(opts.dir)).reverse().find((m) =>
      m.to.some((t) => t.toLowerCase() === wanted) &&
      (opts.subject === undefined || (typeof opts.subject === 'string' ? m.subject.includes(opts.subject) : opts.subject.test(m.subject))));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${opts.to} within ${opts.timeoutMs ?? 10_000} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
