import { describe, expect, it } from 'vitest';
import { assertLoopbackDatabase, isLoopbackHost } from '@/db/loopback-guard';

describe('test and development databases refuse non-loopback hosts', () => {
  it.each(['127.0.0.1', 'localhost', '::1', '[::1]', '127.10.0.3'])('accepts %s', (host) => {
    expect(isLoopbackHost(host)).toBe(true);
  });

  it.each([
    'mysql://root@db.example.org:3306/ohmstead',
    'mysql://root@10.0.0.5:3306/ohmstead',
    'mysql://root@192.168.1.20/ohmstead',
    'mysql://root@128.0.0.1/ohmstead',
  ])('refuses %s', (url) => {
    expect(() => assertLoopbackDatabase(url)).toThrow(/must be on loopback/);
  });

  it('accepts the test database URL', () => {
    expect(() => assertLoopbackDatabase('mysql://root@127.0.0.1:3317/ohmstead_test')).not.toThrow();
  });

  it('explains a malformed URL', () => {
    expect(() => assertLoopbackDatabase('not a url')).toThrow(/not a valid URL/);
  });
});
