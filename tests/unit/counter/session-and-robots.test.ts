// COUNTER user-sessions (hashed, never raw) and the robot filter (the isbot package's maintained list).
import { createHash, createHmac } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { isRobotUserAgent } from '@/lib/counter/is-robot';
import { viewerFromHeaders } from '@/lib/counter/request-source';
import { dailySalt, sessionHash, sessionHashesNear } from '@/lib/counter/session-hash';

const SECRET = 'unit-test-secret-of-at-least-32-characters!';
const client = { kind: 'client', ip: '192.0.2.17', userAgent: 'Mozilla/5.0 (X11; Linux x86_64; rv:128.0) Gecko/20100101 Firefox/128.0' } as const;
const t = (iso: string) => new Date(iso);

describe('sessionHash', () => {
  it('is SHA-256 of the daily salt, the identity and the UTC hour (written out by hand here)', () => {
    const at = t('2031-03-01T10:01:00Z');
    const salt = createHmac('sha256', SECRET).update('ohmstead/counter-session/2031-03-01').digest('hex');
    expect(dailySalt(SECRET, at)).toBe(salt);
    const expected = createHash('sha256').update(`${salt}\nuser:usr-42\n2031-03-01T10`).digest('hex');
    expect(sessionHash(SECRET, { kind: 'user', userId: 'usr-42' }, at)).toBe(expected);
  });

  it('stays the same within an hour, changes with the hour, the day and the client', () => {
    const a = sessionHash(SECRET, client, t('2031-03-01T10:00:00Z'));
    expect(sessionHash(SECRET, client, t('2031-03-01T10:59:59.999Z'))).toBe(a);
    expect(sessionHash(SECRET, client, t('2031-03-01T11:00:00Z'))).not.toBe(a);
    expect(sessionHash(SECRET, client, t('2031-03-02T10:00:00Z'))).not.toBe(a);
    expect(sessionHash(SECRET, { ...client, userAgent: 'curl/8.5.0' }, t('2031-03-01T10:00:00Z'))).not.toBe(a);
    expect(dailySalt(SECRET, t('2031-03-01T00:00:00Z'))).not.toBe(dailySalt(SECRET, t('2031-03-02T00:00:00Z')));
  });

  it('holds no trace of the IP or user agent in clear', () => {
    const h = sessionHash(SECRET, client, t('2031-03-01T10:00:00Z'));
    expect(h).toMatch(/^[0-9a-f]{64}$/);
    expect(h).not.toContain('192');
  });

  it('anonymous links make the session from the link alone', () => {
    const at = t('2031-03-01T10:00:00Z');
    expect(sessionHash(SECRET, { kind: 'link', linkId: 'lnk-1' }, at)).not.toBe(sessionHash(SECRET, { kind: 'link', linkId: 'lnk-2' }, at));
  });

  it('looks back across the hour only in its first 30 s', () => {
    expect(sessionHashesNear(SECRET, client, t('2031-03-01T10:30:00Z'), 30_000)).toHaveLength(1);
    const turn = sessionHashesNear(SECRET, client, t('2031-03-01T11:00:10Z'), 30_000);
    expect(turn).toEqual([sessionHash(SECRET, client, t('2031-03-01T11:00:10Z')), sessionHash(SECRET, client, t('2031-03-01T10:59:40Z'))]);
  });
});

describe('isRobotUserAgent (isbot)', () => {
  it.each([
    ['Mozilla/5.0 (compatible; Googlebot/2.1; +http://www.google.com/bot.html)', true],
    ['Mozilla/5.0 (compatible; bingbot/2.0; +http://www.bing.com/bingbot.htm)', true],
    ['curl/8.5.0', true],
    ['python-requests/2.31.0', true],
    ['Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) HeadlessChrome/120.0.0.0 Safari/537.36', true],
    ['Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:128.0) Gecko/20100101 Firefox/128.0', false],
    ['Mozilla/5.0 (iPhone; CPU iPhone OS 17_4 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.4 Mobile/15E148 Safari/604.1', false],
    ['', false],
    [null, false],
  ])('%s → %s', (ua, robot) => {
    expect(isRobotUserAgent(ua)).toBe(robot);
  });
});

describe('viewerFromHeaders', () => {
  it('takes the address our proxy appended (not what the client wrote before it), else X-Real-IP, and the user agent', () => {
    const h = new Headers({ 'x-forwarded-for': '10.0.0.1, 198.51.100.4', 'user-agent': 'Firefox' });
    expect(viewerFromHeaders(h, 'usr-1')).toEqual({ userId: 'usr-1', ip: '198.51.100.4', userAgent: 'Firefox' });
    expect(viewerFromHeaders(new Headers({ 'x-real-ip': '203.0.113.9' }))).toEqual({ userId: null, ip: '203.0.113.9', userAgent: null });
  });
});
