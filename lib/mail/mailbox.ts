import 'server-only';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { env } from '@/lib/env';

// Reads the messages that the local SMTP fake keeps (development and tests only).
export type MailboxMessage = { id: string; date: string; from: string; to: string[]; subject: string; text: string; links: string[] };

export function mailboxEnabled(): boolean {
  return Boolean(env().MAIL_DIR);
}

export async function listMailbox(limit = 100): Promise<MailboxMessage[]> {
  const dir = env().MAIL_DIR;
  if (!dir) return [];
  let names: string[];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json'));
  } catch {
    return [];
  }
  const newest = names.sort().reverse().slice(0, limit);
  const messages = await Promise.all(
    newest.map(async (n) => JSON.parse(await readFile(path.join(dir, n), 'utf8')) as MailboxMessage),
  );
  return messages;
}
