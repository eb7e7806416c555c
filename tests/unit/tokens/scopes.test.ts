import { describe, expect, it } from 'vitest';
import { hasScope, parseScopes, scopeForRequest } from '@/lib/tokens/scopes';

describe('token scopes', () => {
  it('grant what they name, writing scopes include read, admin includes all', () => {
    expect(hasScope(['read'], 'read')).toBe(true);
    expect(hasScope(['read'], 'deposit')).toBe(false);
    expect(hasScope(['read'], 'publish')).toBe(false);
    expect(hasScope(['deposit'], 'read')).toBe(true);
    expect(hasScope(['deposit'], 'publish')).toBe(false);
    expect(hasScope(['publish'], 'deposit')).toBe(false);
    expect(hasScope(['publish'], 'read')).toBe(true);
    expect(hasScope(['deposit', 'publish'], 'publish')).toBe(true);
    expect(hasScope(['admin'], 'publish')).toBe(true);
    expect(hasScope(['admin'], 'deposit')).toBe(true);
    expect(hasScope(['publish'], 'admin')).toBe(false);
    expect(hasScope([], 'read')).toBe(false);
  });

  it('are read back from stored JSON in canonical order, unknown names dropped', () => {
    expect(parseScopes('["publish","read"]')).toEqual(['read', 'publish']);
    expect(parseScopes(['admin', 'root', 'deposit'])).toEqual(['deposit', 'admin']);
    expect(parseScopes('not json')).toEqual([]);
    expect(parseScopes('{"read":true}')).toEqual([]);
  });

  it.each([
    ['GET', '/api/v1/drafts', 'read'],
    ['HEAD', '/api/v1/versions/abc', 'read'],
    ['POST', '/api/v1/datasets', 'deposit'],
    ['PUT', '/api/v1/versions/abc/metadata', 'deposit'],
    ['DELETE', '/api/v1/files/abc', 'deposit'],
    ['POST', '/api/v1/versions/abc/submit', 'deposit'],
    ['POST', '/api/v1/versions/abc/new-version', 'deposit'],
    ['POST', '/api/v1/versions/abc/publish', 'publish'],
    ['POST', '/api/v1/versions/abc/withdraw', 'publish'],
    ['POST', '/api/v1/versions/abc/return', 'publish'],
    ['GET', '/api/v1/versions/abc/publish', 'read'],
    ['GET', '/api/v1/admin/audit', 'admin'],
    ['POST', '/api/v1/admin', 'admin'],
    ['GET', '/api/v1/administrators', 'read'],
  ] as const)('%s %s needs %s', (method, path, scope) => {
    expect(scopeForRequest(method, path)).toBe(scope);
  });
});
