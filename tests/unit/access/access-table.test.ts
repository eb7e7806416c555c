// Every (actor × state × action) cell of lib/access against the hand-written table in expected-matrix.ts.
import { describe, expect, it } from 'vitest';
import { ACTIONS, decide, type Action } from '@/lib/access';
import { ACTOR_NAMES, CODE_OF, EXPECTED, STATE_CASES, type ActorName, type Short, type StateCase } from './expected-matrix';
import { ACTORS, SITUATIONS } from './fixtures';

type Cell = { state: StateCase; action: Action; actor: ActorName; expected: Short; outcome: string };

const CELLS: Cell[] = STATE_CASES.flatMap((state) =>
  ACTIONS.flatMap((action) =>
    ACTOR_NAMES.map((actor, column) => {
      const expected = EXPECTED[state][action][column];
      return { state, action, actor, expected, outcome: expected === 'ok' ? 'allowed' : CODE_OF[expected] };
    }),
  ),
);

describe('access table', () => {
  it('covers 10 actors × 7 states × 14 actions, with one expected row per action', () => {
    expect(ACTIONS).toHaveLength(14);
    for (const state of STATE_CASES) expect(Object.keys(EXPECTED[state]).sort()).toEqual([...ACTIONS].sort());
    expect(CELLS).toHaveLength(980);
  });

  it.each(CELLS)('$state | $action | $actor → $outcome', ({ state, action, actor, expected }) => {
    const { resource, now } = SITUATIONS[state];
    const decision = decide(ACTORS[actor], action, resource, now);
    if (expected === 'ok') {
      expect(decision).toEqual({ allowed: true });
    } else {
      expect(decision.allowed).toBe(false);
      expect(decision.allowed ? null : decision.code).toBe(CODE_OF[expected]);
      expect(decision.allowed ? '' : decision.reason).toMatch(/^[A-Z].{10,}\.$/);
    }
  });
});
