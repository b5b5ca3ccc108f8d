/**
 * Deterministic random numbers, so tests, demos, fuzzing and the held-out mocks reproduce exactly
 * on every machine. mulberry32 (Tommy Ettinger's 32-bit generator, common practice): small, fast,
 * uniform in [0, 1).
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates from a uniform source (Box–Muller, one value per two uniforms; 1 − u keeps the log finite). */
export function gaussianFrom(uniform: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}
