// Times are stored in UTC and shown in the viewer's zone with the zone named (DEVELOPERS.md, "Conventions").

/** The viewer's IANA zone ('Europe/Oslo'), or 'UTC' where the runtime does not say. */
export function viewerTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

/** '14:02:31 (Europe/Oslo)': a clock time with seconds and the zone it is in. */
export function formatClockTime(date: Date, timeZone: string = viewerTimeZone()): string {
  const time = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23' }).format(date);
  return `${time} (${timeZone})`;
}

/** '2 Dec 2026, 14:02 (Europe/Oslo)': a date and time in the given zone, named. */
export function formatDateTime(date: Date, timeZone: string = viewerTimeZone()): string {
  const text = new Intl.DateTimeFormat('en-GB', {
    timeZone, day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23',
  }).format(date);
  return `${text} (${timeZone})`;
}
