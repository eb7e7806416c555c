'use client';

import { useSyncExternalStore } from 'react';
import { formatDateTime } from '@/lib/format/date-time';

const noSubscription = () => () => {};

/** A stored UTC instant in the viewer's zone, named; the server's first render says UTC until the browser takes over. */
export function LocalTime({ iso }: { iso: string }) {
  const zone = useSyncExternalStore(noSubscription, () => Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC', () => 'UTC');
  return <time dateTime={iso}>{formatDateTime(new Date(iso), zone)}</time>;
}
