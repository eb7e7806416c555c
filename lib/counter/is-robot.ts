import { isbot } from 'isbot';

// Robots and crawlers are left out of COUNTER counts (COUNTER Code of Practice for Research Data: exclude robots
// by user agent). The pattern list is the isbot package's, kept up to date by its maintainers.

/** True when the user agent names a known robot, crawler, monitor or scripted client. No user agent → false. */
export function isRobotUserAgent(userAgent: string | null | undefined): boolean {
  const ua = typeof userAgent === 'string' ? userAgent.trim() : '';
  return ua !== '' && isbot(ua);
}
