// Which X-Forwarded-For entry is the client: each proxy appends the address it saw (nginx $proxy_add_x_forwarded_for;
// the list grammar of RFC 7239 §7.1 for X-Forwarded-For as deployed), so only the rightmost N entries, for N trusted
// proxies, can be believed. Common practice. Addresses are from the documentation ranges of RFC 5737.
import { describe, expect, it } from 'vitest';
import { clientAddress, DEFAULT_TRUSTED_PROXY_HOPS, trustedProxyHops } from '@/lib/http/client-address';

describe('clientAddress', () => {
  it('behind one proxy, a forged leftmost entry is ignored: the proxy appended the real client', () => {
    const h = new Headers({ 'x-forwarded-for': '203.0.113.66, 198.51.100.7' });
    expect(clientAddress(h, 1)).toBe('198.51.100.7');
  });

  it('behind two proxies, the entry the outer proxy appended is the client', () => {
    const h = new Headers({ 'x-forwarded-for': '203.0.113.66, 198.51.100.7, 10.0.0.2' });
    expect(clientAddress(h, 2)).toBe('198.51.100.7');
  });

  it('a single entry (a direct request, filled in by the server) is the client', () => {
    expect(clientAddress(new Headers({ 'x-forwarded-for': '192.0.2.10' }), 1)).toBe('192.0.2.10');
    expect(clientAddress({ 'x-forwarded-for': '192.0.2.10' }, 1)).toBe('192.0.2.10');
  });

  it('fewer entries than proxies takes the leftmost; blanks are skipped; X-Real-IP is the fallback; else null', () => {
    expect(clientAddress(new Headers({ 'x-forwarded-for': '192.0.2.10' }), 3)).toBe('192.0.2.10');
    expect(clientAddress(new Headers({ 'x-forwarded-for': ' , 192.0.2.11 ,' }), 1)).toBe('192.0.2.11');
    expect(clientAddress(new Headers({ 'x-real-ip': ' 192.0.2.12 ' }), 1)).toBe('192.0.2.12');
    expect(clientAddress(new Headers(), 1)).toBeNull();
    expect(clientAddress(undefined, 1)).toBeNull();
  });

  it('reads TRUSTED_PROXY_HOPS, falling back to one proxy for blank or nonsense values', () => {
    expect(trustedProxyHops('2')).toBe(2);
    for (const v of [undefined, '', '0', '-1', '1.5', 'two']) expect(trustedProxyHops(v)).toBe(DEFAULT_TRUSTED_PROXY_HOPS);
  });
});
