import type { Resource } from './types';

const DAY_MS = 86_400_000;

/** The instant files open: 00:00 UTC on the embargo date (any time part is dropped). */
export function embargoEndsAt(resource: Pick<Resource, 'embargoUntil'>): Date | null {
  if (resource.embargoUntil === null) return null;
  const ms = resource.embargoUntil.getTime();
  return new Date(Math.floor(ms / DAY_MS) * DAY_MS);
}

/**
 * True while the embargo date is still ahead of `now` (files open when now >= 00:00 UTC of it).
 * Date-only check; it matters for access once the version is published.
 */
export function isEmbargoed(resource: Pick<Resource, 'embargoUntil'>, now: Date = new Date()): boolean {
  const end = embargoEndsAt(resource);
  return end !== null && now.getTime() < end.getTime();
}

/** The embargo date as YYYY-MM-DD (UTC), for messages. */
export function formatEmbargoDate(resource: Pick<Resource, 'embargoUntil'>): string | null {
  const end = embargoEndsAt(resource);
  return end === null ? null : end.toISOString().slice(0, 10);
}
