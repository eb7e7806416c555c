import { createHash, createHmac } from 'node:crypto';

// COUNTER user-sessions without storing who: SHA-256 of a daily salt, the user (or IP + user agent) and the hour.
// COUNTER R5 Code of Practice §7.3 (from memory): a session is the user plus the date and hour of the transaction.

/** Where a session's identity comes from; only the hash below is ever stored. */
export type SessionSource =
  | { kind: 'user'; userId: string }
  | { kind: 'client'; ip: string | null; userAgent: string | null }
  /** Anonymous reviewer links: the link stands for the session, so no IP or user agent enters even the hash. */
  | { kind: 'link'; linkId: string };

/** The salt of one UTC day, derived from the server secret: hashes of different days cannot be joined. */
export function dailySalt(secret: string, at: Date): string {
  return createHmac('sha256', secret).update(`ohmstead/counter-session/${at.toISOString().slice(0, 10)}`).digest('hex');
}

function identity(source: SessionSource): string {
  switch (source.kind) {
    case 'user': return `user:${source.userId}`;
    case 'client': return `client:${source.ip ?? '-'}\n${source.userAgent ?? '-'}`;
    case 'link': return `link:${source.linkId}`;
  }
}

/** 64 hex characters; the same for one source within one UTC hour. */
export function sessionHash(secret: string, source: SessionSource, at: Date): string {
  const hour = at.toISOString().slice(0, 13); // YYYY-MM-DDTHH, UTC
  return createHash('sha256').update(`${dailySalt(secret, at)}\n${identity(source)}\n${hour}`).digest('hex');
}

/** The session now and, right after the hour turns, the one `lookBackMs` earlier (so a double-click spanning it is caught). */
export function sessionHashesNear(secret: string, source: SessionSource, at: Date, lookBackMs: number): string[] {
  const now = sessionHash(secret, source, at);
  const before = sessionHash(secret, source, new Date(at.getTime() - lookBackMs));
  return now === before ? [now] : [now, before];
}
