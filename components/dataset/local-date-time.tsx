'use client';

import { useSyncExternalStore } from 'react';

const noSubscription = () => () => {};
const browserZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';

export type LocalDateTimeProps = { iso: string; withTime?: boolean };

/**
 * A stored UTC instant in the viewer's zone, with the zone named ("2 Dec 2026, 21:56 (Europe/Oslo)"); the server's
 * render says UTC until the browser knows better.
 */
export function LocalDateTime({ iso, withTime = true }: LocalDateTimeProps) {
  const zone = useSyncExternalStore(noSubscription, browserZone, () => 'UTC');
  const text = new Intl.DateTimeFormat('en-GB', {
    timeZone: zone, day: 'numeric', month: 'short', year: 'numeric',
    ...(withTime ? { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' } : {}),
  }).format(new Date(iso));
  return <time dateTime={iso}>{`${text} (${zone})`}</time>;
}
