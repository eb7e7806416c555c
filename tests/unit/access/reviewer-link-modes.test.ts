// Reviewer links, cell by cell, in the mode the main table does not use: expected-matrix.ts fixes a valid and an
// expired link in named mode and a revoked link in anonymous mode. Anonymous mode changes what the page shows, never
// what the link may do (issue 6), so each link state in the other mode must give exactly the hand-written column.
import { describe, expect, it } from 'vitest';
import { decide, type Action, type Actor } from '@/lib/access';
import { ACTOR_NAMES, CODE_OF, EXPECTED, STATE_CASES, type ActorName } from './expected-matrix';
import { ACTORS, SITUATIONS } from './fixtures';

const LINK_ACTIONS: readonly Action[] = ['view_metadata', 'view_curves', 'download_files'];
const LINKS: readonly ActorName[] = ['reviewer link (valid)', 'reviewer link (expired)', 'reviewer link (revoked)', 'reviewer link (other version)'];

function otherMode(name: ActorName): Actor {
  const actor = ACTORS[name];
  if (actor.kind !== 'reviewer') throw new Error(`${name} is not a reviewer link`);
  return { kind: 'reviewer', link: { ...actor.link, anonymous: !actor.link.anonymous } };
}

const CELLS = STATE_CASES.flatMap((state) =>
  LINK_ACTIONS.flatMap((action) => LINKS.map((link) => ({ state, action, link, expected: EXPECTED[state][action][ACTOR_NAMES.indexOf(link)] }))),
);

describe('reviewer links in the other mode (anonymous ↔ named)', () => {
  it('covers 4 link states × 7 states × 3 actions', () => {
    expect(CELLS).toHaveLength(84);
  });

  it.each(CELLS)('$state | $action | $link, mode flipped → $expected', ({ state, action, link, expected }) => {
    const { resource, now } = SITUATIONS[state];
    const decision = decide(otherMode(link), action, resource, now);
    if (expected === 'ok') expect(decision).toEqual({ allowed: true });
    else expect(decision.allowed ? null : decision.code).toBe(CODE_OF[expected]);
  });

  it('a valid link lets a referee view and download under draft, in review and embargo; withdrawn shows only the tombstone', () => {
    const valid = ACTORS['reviewer link (valid)'];
    const can = (state: keyof typeof SITUATIONS) => LINK_ACTIONS.map((a) => decide(valid, a, SITUATIONS[state].resource, SITUATIONS[state].now).allowed);
    expect(can('draft')).toEqual([true, true, true]);
    expect(can('in_review')).toEqual([true, true, true]);
    expect(can('published')).toEqual([true, true, true]);
    expect(can('published, embargoed (date ahead)')).toEqual([true, true, true]);
    expect(can('withdrawn')).toEqual([true, false, false]);
  });
});
