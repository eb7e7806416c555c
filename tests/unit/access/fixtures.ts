// Actors and resources for the access tests; fixed instants so every run is the same.
import type { Actor, Resource } from '@/lib/access';
import type { ActorName, StateCase } from './expected-matrix';

export const VERSION_ID = 'ver-7f3a-hall-bar-sample';
export const NOW = new Date('2031-03-01T12:00:00.000Z');
export const EMBARGO_DATE = new Date('2031-03-12T00:00:00.000Z');

const LINK_EXPIRES = new Date('2031-06-01T00:00:00.000Z');

export const ACTORS: Readonly<Record<ActorName, Actor>> = {
  anonymous: { kind: 'anonymous' },
  'signed-in user, no group role': { kind: 'user', userId: 'usr-outsider', siteRole: 'user' },
  member: { kind: 'user', userId: 'usr-member', siteRole: 'user', groupRole: 'member' },
  curator: { kind: 'user', userId: 'usr-curator', siteRole: 'user', groupRole: 'curator' },
  owner: { kind: 'user', userId: 'usr-owner', siteRole: 'user', groupRole: 'owner' },
  'site admin': { kind: 'user', userId: 'usr-admin', siteRole: 'admin' },
  'reviewer link (valid)': {
    kind: 'reviewer',
    link: { versionId: VERSION_ID, expiresAt: LINK_EXPIRES, revokedAt: null, anonymous: false },
  },
  'reviewer link (expired)': {
    kind: 'reviewer',
    link: { versionId: VERSION_ID, expiresAt: new Date('2031-02-01T00:00:00.000Z'), revokedAt: null, anonymous: false },
  },
  'reviewer link (revoked)': {
    kind: 'reviewer',
    link: { versionId: VERSION_ID, expiresAt: LINK_EXPIRES, revokedAt: new Date('2031-02-15T09:30:00.000Z'), anonymous: true },
  },
  'reviewer link (other version)': {
    kind: 'reviewer',
    link: { versionId: 'ver-other-dataset', expiresAt: LINK_EXPIRES, revokedAt: null, anonymous: false },
  },
};

export type Situation = { resource: Resource; now: Date };

const base = { versionId: VERSION_ID, isLatest: true } as const;

export const SITUATIONS: Readonly<Record<StateCase, Situation>> = {
  draft: { resource: { ...base, state: 'draft', embargoUntil: null }, now: NOW },
  in_review: { resource: { ...base, state: 'in_review', embargoUntil: null }, now: NOW },
  published: { resource: { ...base, state: 'published', embargoUntil: null }, now: NOW },
  'published, embargoed (date ahead)': {
    resource: { ...base, state: 'published', embargoUntil: EMBARGO_DATE },
    now: NOW,
  },
  'published, embargo 1 ms before 00:00 UTC': {
    resource: { ...base, state: 'published', embargoUntil: EMBARGO_DATE },
    now: new Date('2031-03-11T23:59:59.999Z'),
  },
  'published, embargo exactly 00:00 UTC': {
    resource: { ...base, state: 'published', embargoUntil: EMBARGO_DATE },
    now: new Date('2031-03-12T00:00:00.000Z'),
  },
  withdrawn: { resource: { ...base, state: 'withdrawn', embargoUntil: null }, now: NOW },
};
