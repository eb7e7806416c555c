// A stored link row becomes the lib/access ReviewerLinkGrant that decide() reads (permissions.ts: reviewers are INSIDERS).
import { describe, expect, it } from 'vitest';
import { allowedActions, decide, type Resource } from '@/lib/access';
import { grantOf, LINK_PROBLEM_MESSAGES } from '@/lib/review/resolve-reviewer-link';

const NOW = new Date('2031-03-01T12:00:00.000Z');
const row = { version_id: 'ver-1', expires_at: new Date('2031-03-31T12:00:00Z'), revoked_at: null, anonymous: true };
const resource = (over: Partial<Resource>): Resource => ({ versionId: 'ver-1', state: 'draft', embargoUntil: null, isLatest: true, ...over });

describe('grantOf', () => {
  it('copies version, expiry, revocation and anonymous mode', () => {
    expect(grantOf(row)).toEqual({ versionId: 'ver-1', expiresAt: new Date('2031-03-31T12:00:00Z'), revokedAt: null, anonymous: true });
  });

  it('lets a valid link view and download its own version under embargo, and nothing else', () => {
    const actor = { kind: 'reviewer', link: grantOf(row) } as const;
    const embargoed = resource({ state: 'published', embargoUntil: new Date('2031-06-01T00:00:00Z') });
    expect(allowedActions(actor, embargoed, NOW)).toEqual(['view_metadata', 'view_curves', 'download_files']);
    expect(decide(actor, 'view_metadata', resource({ versionId: 'ver-2' }), NOW)).toMatchObject({ allowed: false, code: 'not_found' });
  });

  it('an expired or revoked row is refused with the words the page shows', () => {
    const expired = { kind: 'reviewer', link: grantOf({ ...row, expires_at: new Date('2031-02-01T00:00:00Z') }) } as const;
    expect(decide(expired, 'view_curves', resource({}), NOW)).toEqual({ allowed: false, code: 'link_expired', reason: LINK_PROBLEM_MESSAGES.expired });
    const revoked = { kind: 'reviewer', link: grantOf({ ...row, revoked_at: new Date('2031-02-15T00:00:00Z') }) } as const;
    expect(decide(revoked, 'view_curves', resource({}), NOW)).toEqual({ allowed: false, code: 'link_revoked', reason: LINK_PROBLEM_MESSAGES.revoked });
  });
});
