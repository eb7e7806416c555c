import { describe, expect, it } from 'vitest';
import { TextArena } from '@/lib/search/text-arena';

// Round trips are checked against the input strings themselves.
describe('TextArena', () => {
  it('gives back every field exactly, including text outside ASCII and outside the BMP', () => {
    const arena = new TextArena(2);
    arena.grow(3);
    const values = [['ρ(T) of YBa₂Cu₃O₇₋δ, 2–300 K', 'naïve 𝑥 test'], ['', 'plain'], ['10.99999/ohm.1', '']];
    values.forEach((v, slot) => arena.set(slot, v));
    values.forEach((v, slot) => expect([arena.get(slot, 0), arena.get(slot, 1)]).toEqual(v));
  });

  it('replaces, clears and compacts without disturbing other slots', () => {
    const arena = new TextArena(1);
    arena.grow(200);
    const long = (slot: number) => `version ${slot} `.repeat(1000); // ~12 kB each on even slots
    for (let slot = 0; slot < 200; slot++) arena.set(slot, [slot % 2 === 0 ? long(slot) : `short ${slot}`]);
    // Rewriting the even slots turns over 1 MiB, more than half the buffer, into garbage: the arena compacts.
    for (let round = 0; round < 4; round++) for (let slot = 0; slot < 200; slot += 2) arena.set(slot, [`new ${round} ${slot}`]);
    arena.clear(199);
    // Without compaction ~1.2 MB would be garbage; after it, only what was replaced since (under 14 long values).
    expect((arena as unknown as { garbage: number }).garbage).toBeLessThan(200_000);
    for (let slot = 0; slot < 199; slot++) expect(arena.get(slot, 0)).toBe(slot % 2 === 0 ? `new 3 ${slot}` : `short ${slot}`);
    expect(arena.get(199, 0)).toBe('');
  });

  it('keeps null apart from the empty string', () => {
    const arena = new TextArena(2);
    arena.grow(3);
    arena.set(0, [null, '']);
    arena.set(1, ['', null]);
    expect([arena.getOrNull(0, 0), arena.getOrNull(0, 1), arena.getOrNull(1, 0), arena.getOrNull(1, 1)]).toEqual([null, '', '', null]);
    expect([arena.get(0, 0), arena.get(1, 1)]).toEqual(['', '']);
    // A null replaced by text, and text replaced by null.
    arena.set(0, ['10.99999/ohm.7', 'x']);
    arena.set(1, [null, null]);
    expect([arena.getOrNull(0, 0), arena.getOrNull(1, 0), arena.getOrNull(2, 0)]).toEqual(['10.99999/ohm.7', null, '']);
  });

  it('keeps values across growth of the slot count', () => {
    const arena = new TextArena(1);
    arena.grow(2);
    arena.set(1, ['kept']);
    arena.grow(10);
    arena.set(9, ['later']);
    expect([arena.get(1, 0), arena.get(9, 0), arena.get(5, 0)]).toEqual(['kept', 'later', '']);
  });
});
