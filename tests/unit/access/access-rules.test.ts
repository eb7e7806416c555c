// Edges of lib/access beyond the table: embargo boundary, link validity, no existence leak, errors, docs.
import { describe, expect, it } from 'vitest';
import {
  ACCESS_MATRIX_DOC,
  ACTION_DESCRIPTIONS,
  ACTIONS,
  AccessDeniedError,
  NOT_FOUND_REASON,
  PERMISSIONS,
  PHASES,
  allowedActions,
  assertAllowed,
  can,
  decide,
  embargoEndsAt,
  isEmbargoed,
  renderAccessMatrix,
  type Actor,
  type Resource,
} from '@/lib/access';
import { ACTORS, EMBARGO_DATE, NOW, SITUATIONS, VERSION_ID } from './fixtures';

const embargoed: Resource = SITUATIONS['published, embargoed (date ahead)'].resource;
const draft: Resource = SITUATIONS.draft.resource;

describe('isEmbargoed: ends at 00:00 UTC on its date (product.md "Dates and times")', () => {
  it.each([
    ['2031-03-11T23:59:59.999Z', true],
    ['2031-03-12T00:00:00.000Z', false],
    ['2031-03-12T00:00:00.001Z', false],
    ['2031-03-01T12:00:00.000Z', true],
  ])('at %s → %s', (at, expected) => {
    expect(isEmbargoed(embargoed, new Date(at))).toBe(expected);
  });

  it('no embargo date → never embargoed', () => {
    expect(isEmbargoed({ embargoUntil: null }, NOW)).toBe(false);
    expect(embargoEndsAt({ embargoUntil: null })).toBeNull();
  });

  it('a stored time of day is dropped: the embargo still ends at 00:00 UTC of that date', () => {
    const resource = { embargoUntil: new Date('2031-03-12T15:45:00.000Z') };
    expect(embargoEndsAt(resource)?.toISOString()).toBe('2031-03-12T00:00:00.000Z');
    expect(isEmbargoed(resource, new Date('2031-03-12T00:00:00.000Z'))).toBe(false);
  });

  it('defaults `now` to the current time', () => {
    expect(isEmbargoed({ embargoUntil: new Date('2000-01-01T00:00:00.000Z') })).toBe(false);
    expect(isEmbargoed({ embargoUntil: new Date('9999-12-31T00:00:00.000Z') })).toBe(true);
    expect(can(ACTORS.anonymous, 'download_files', { ...embargoed, embargoUntil: new Date('9999-12-31T00:00:00.000Z') })).toBe(false);
  });

  it('the refusal names the date the files open', () => {
    const d = decide(ACTORS.anonymous, 'download_files', embargoed, NOW);
    expect(d).toEqual({
      allowed: false,
      code: 'embargoed',
      reason: 'The files of this version are under embargo until 2031-03-12 at 00:00 UTC.',
    });
    const curves = decide(ACTORS['signed-in user, no group role'], 'view_curves', embargoed, NOW);
    expect(curves.allowed ? '' : curves.reason).toContain('curves');
    expect(EMBARGO_DATE.toISOString()).toBe('2031-03-12T00:00:00.000Z');
  });
});

describe('reviewer links', () => {
  const link = (over: Partial<Extract<Actor, { kind: 'reviewer' }>['link']>): Actor => ({
    kind: 'reviewer',
    link: { versionId: VERSION_ID, expiresAt: new Date('2031-06-01T00:00:00.000Z'), revokedAt: null, anonymous: false, ...over },
  });

  it('valid while now < expiresAt; expired at the exact instant', () => {
    const expiresAt = new Date('2031-03-01T12:00:00.000Z');
    expect(can(link({ expiresAt }), 'view_curves', draft, new Date(expiresAt.getTime() - 1))).toBe(true);
    const atExpiry = decide(link({ expiresAt }), 'view_curves', draft, expiresAt);
    expect(atExpiry.allowed ? null : atExpiry.code).toBe('link_expired');
  });

  it('revoked wins over expired; another version wins over both', () => {
    const both = { expiresAt: new Date('2031-01-01T00:00:00.000Z'), revokedAt: new Date('2030-12-01T00:00:00.000Z') };
    const r1 = decide(link(both), 'view_metadata', draft, NOW);
    expect(r1.allowed ? null : r1.code).toBe('link_revoked');
    const r2 = decide(link({ ...both, versionId: 'ver-elsewhere' }), 'view_metadata', draft, NOW);
    expect(r2).toEqual({ allowed: false, code: 'not_found', reason: NOT_FOUND_REASON });
  });

  it('anonymous mode changes what is shown, not what the link may do', () => {
    expect(allowedActions(link({ anonymous: true }), embargoed, NOW)).toEqual(['view_metadata', 'view_curves', 'download_files']);
    expect(allowedActions(link({ anonymous: false }), embargoed, NOW)).toEqual(['view_metadata', 'view_curves', 'download_files']);
  });
});

describe('hidden versions never leak that they exist', () => {
  const outsiders = [ACTORS.anonymous, ACTORS['signed-in user, no group role'], ACTORS['reviewer link (other version)']];
  const hidden = [SITUATIONS.draft.resource, SITUATIONS.in_review.resource];

  it.each(ACTIONS)('%s: every outsider gets the same not_found, naming nothing', (action) => {
    for (const resource of hidden) {
      for (const actor of outsiders) {
        const d = decide(actor, action, resource, NOW);
        expect(d).toEqual({ allowed: false, code: 'not_found', reason: NOT_FOUND_REASON });
      }
    }
    expect(NOT_FOUND_REASON).not.toMatch(/draft|review|embargo|withdraw|publish/i);
    expect(NOT_FOUND_REASON).not.toContain(VERSION_ID);
  });
});

describe('combined roles and conditions', () => {
  it('a site admin who is also a member gets the union of both rows', () => {
    const adminMember: Actor = { kind: 'user', userId: 'usr-admin', siteRole: 'admin', groupRole: 'member' };
    expect(can(adminMember, 'edit', draft, NOW)).toBe(true);
    expect(can(ACTORS['site admin'], 'edit', draft, NOW)).toBe(false);
    expect(can(adminMember, 'publish', draft, NOW)).toBe(false);
  });

  it('create_version only from the latest version; unknown latest is not refused', () => {
    const published = SITUATIONS.published.resource;
    const old = decide(ACTORS.member, 'create_version', { ...published, isLatest: false }, NOW);
    expect(old.allowed ? null : old.code).toBe('wrong_state');
    expect(can(ACTORS.member, 'create_version', { ...published, isLatest: undefined }, NOW)).toBe(true);
  });
});

describe('assertAllowed and AccessDeniedError', () => {
  it.each([
    ['not_signed_in', 401, ACTORS.anonymous, 'edit', SITUATIONS.published.resource],
    ['not_found', 404, ACTORS.anonymous, 'view_metadata', draft],
    ['forbidden', 403, ACTORS.member, 'publish', draft],
    ['embargoed', 403, ACTORS.anonymous, 'download_files', embargoed],
    ['wrong_state', 403, ACTORS.owner, 'edit', SITUATIONS.in_review.resource],
    ['link_expired', 403, ACTORS['reviewer link (expired)'], 'view_curves', draft],
    ['link_revoked', 403, ACTORS['reviewer link (revoked)'], 'view_curves', draft],
  ] as const)('%s → HTTP %i', (code, status, actor, action, resource) => {
    let caught: unknown;
    try {
      assertAllowed(actor, action, resource, NOW);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(AccessDeniedError);
    const err = caught as AccessDeniedError;
    expect([err.code, err.status, err.name]).toEqual([code, status, 'AccessDeniedError']);
    expect(err.message).toBe((decide(actor, action, resource, NOW) as { reason: string }).reason);
  });

  it('does not throw when allowed', () => {
    expect(assertAllowed(ACTORS.curator, 'publish', draft, NOW)).toBeUndefined();
  });
});

describe('table and documentation', () => {
  it('every action has a description and a cell in every phase', () => {
    for (const action of ACTIONS) expect(ACTION_DESCRIPTIONS[action].length).toBeGreaterThan(20);
    for (const phase of PHASES) expect(Object.keys(PERMISSIONS[phase]).sort()).toEqual([...ACTIONS].sort());
  });

  it('renders one markdown row per phase × action', () => {
    const doc = renderAccessMatrix();
    expect(doc).toBe(ACCESS_MATRIX_DOC);
    expect(doc.split('\n').filter((line) => /^\| (draft|in review|published|withdrawn)/.test(line))).toHaveLength(5 * 14);
    expect(doc).toContain('| draft | `publish` | `not_found` | `not_found` | `forbidden` | ✓ | ✓ | `forbidden` | `forbidden` |');
    expect(doc).toContain(
      '| published, files embargoed | `download_files` | `embargoed` | `embargoed` | ✓ | ✓ | ✓ | ✓ | ✓ |',
    );
  });
});
