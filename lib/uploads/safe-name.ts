// File names are shown as the author gave them, never used in storage keys (those are staging/<fileId>/… and
// blobs/sha256/…), so "../", "/" and control characters are harmless; only what no database or file system keeps is refused.

export const MAX_NAME_CHARS = 255;

export type NameCheck = { ok: true; name: string } | { ok: false; message: string };

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export function checkFileName(raw: unknown): NameCheck {
  if (typeof raw !== 'string') return { ok: false, message: 'Give the file a name.' };
  const name = raw.trim();
  if (name === '') return { ok: false, message: 'The file name is empty.' };
  if (name.includes('\u0000')) return { ok: false, message: 'The file name contains a NUL character, which no file system accepts. Rename the file.' };
  if (LONE_SURROGATE.test(name)) return { ok: false, message: 'The file name is not valid Unicode text. Rename the file.' };
  // VARCHAR(255) in utf8mb4 counts characters (code points), not UTF-16 units.
  if ([...name].length > MAX_NAME_CHARS) return { ok: false, message: `The file name is longer than ${MAX_NAME_CHARS} characters. Shorten it.` };
  return { ok: true, name };
}
