// Keeps every message the SMTP fake receives: the raw .eml and a parsed .json, written atomically.
import { randomBytes } from 'node:crypto';
import { mkdir, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';

export type StoredMail = {
  id: string;
  date: string;
  headerDate: string | null;
  messageId: string | null;
  from: string;
  /** Envelope recipients: who the message was actually delivered to (includes Cc and Bcc). */
  to: string[];
  headerTo: string[];
  subject: string;
  text: string;
  html: string | null;
  links: string[];
  size: number;
  eml: string;
  parseError?: string;
};

export type Envelope = { mailFrom: string | null; rcptTo: string[] };

let sequence = 0;

/** Time-first names sort by arrival; the sequence orders messages within one millisecond. */
export function messageId(now: Date): string {
  sequence = (sequence + 1) % 1_000_000;
  const stamp = now.toISOString().replace(/[-:.]/g, '');
  return `${stamp}-${String(sequence).padStart(6, '0')}-${randomBytes(3).toString('hex')}`;
}

// Stop at whitespace, quotes and brackets; trailing sentence punctuation is not part of a link.
const URL_IN_TEXT = /https?:\/\/[^\s<>"'()[\]{}]+/g;

export function extractLinks(text: string, html: string | null): string[] {
  const found: string[] = [];
  for (const m of html?.matchAll(/href\s*=\s*["']([^"']+)["']/gi) ?? []) found.push(m[1].replace(/&amp;/g, '&'));
  for (const m of text.matchAll(URL_IN_TEXT)) found.push(m[0].replace(/[.,;:!?]+$/, ''));
  return [...new Set(found.filter((l) => /^https?:\/\//i.test(l)))];
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((a) => a.value.map((v) => v.address ?? v.name)).filter((x): x is string => Boolean(x));
}

async function writeAtomically(file: string, data: string | Buffer): Promise<void> {
  const tmp = path.join(path.dirname(file), `.${path.basename(file)}.${process.pid}.tmp`);
  await writeFile(tmp, data);
  await rename(tmp, file);
}

export async function storeMessage(dir: string, raw: Buffer, envelope: Envelope, now = new Date()): Promise<StoredMail> {
  await mkdir(dir, { recursive: true });
  const id = messageId(now);
  const eml = `${id}.eml`;
  // The raw message lands first: the .json is what readers list, so its presence implies the .eml.
  await writeAtomically(path.join(dir, eml), raw);
  let record: StoredMail = {
    id, date: now.toISOString(), headerDate: null, messageId: null, from: envelope.mailFrom ?? '', to: envelope.rcptTo,
    headerTo: [], subject: '', text: '', html: null, links: [], size: raw.length, eml,
  };
  try {
    const parsed = await simpleParser(raw);
    const text = parsed.text ?? '';
    const html = typeof parsed.html === 'string' ? parsed.html : null;
    record = {
      ...record,
      headerDate: parsed.date ? parsed.date.toISOString() : null,
      messageId: parsed.messageId ?? null,
      from: parsed.from?.text ?? record.from,
      headerTo: addresses(parsed.to),
      subject: parsed.subject ?? '',
      text,
      html,
      links: extractLinks(text, html),
    };
  } catch (error) {
    record.parseError = error instanceof Error ? error.message : String(error);
  }
  await writeAtomically(path.join(dir, `${id}.json`), JSON.stringify(record, null, 2) + '\n');
  return record;
}
