// Deterministic noise for the invented demo files: mulberry32 (a public-domain 32-bit PRNG) and Box–Muller normals.

/** Uniform numbers in [0, 1) from a 32-bit seed; the same seed always gives the same sequence. */
export function seededUniform(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal numbers (mean 0, σ 1) by the Box–Muller transform. */
export function seededNormal(seed: number): () => number {
  const u = seededUniform(seed);
  return () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}
