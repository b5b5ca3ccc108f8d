/**
 * The independent sky's own seeded generator: xoshiro128** (Blackman & Vigna 2018) seeded through
 * splitmix32, with the draws the sky needs. Deliberately not the engine's generator, so the two
 * synthetic sets share no random streams either.
 */
export interface Random {
  /** Uniform on [0, 1). */
  next(): number;
  uniform(lo: number, hi: number): number;
  /** Uniform in log between lo and hi (both > 0). */
  logUniform(lo: number, hi: number): number;
  /** Standard normal (Marsaglia polar method). */
  gauss(): number;
  /** Poisson count with mean `mean` (inversion; fine for the small means used here). */
  poisson(mean: number): number;
  pick<T>(items: readonly T[]): T;
  chance(p: number): boolean;
}

export function createRandom(seed: number): Random {
  let x = seed >>> 0;
  const splitmix = () => {
    x = (x + 0x9e3779b9) >>> 0;
    let z = x;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
  const s = [splitmix(), splitmix(), splitmix(), splitmix()];
  const rotl = (v: number, k: number) => ((v << k) | (v >>> (32 - k))) >>> 0;
  const nextU32 = () => {
    const result = Math.imul(rotl(Math.imul(s[1]!, 5) >>> 0, 7), 9) >>> 0;
    const t = (s[1]! << 9) >>> 0;
    s[2] = (s[2]! ^ s[0]!) >>> 0;
    s[3] = (s[3]! ^ s[1]!) >>> 0;
    s[1] = (s[1]! ^ s[2]!) >>> 0;
    s[0] = (s[0]! ^ s[3]!) >>> 0;
    s[2] = (s[2]! ^ t) >>> 0;
    s[3] = rotl(s[3]!, 11);
    return result;
  };
  let spare: number | undefined;
  const r: Random = {
    next: () => nextU32() / 4294967296,
    uniform: (lo, hi) => lo + (hi - lo) * r.next(),
    logUniform: (lo, hi) => lo * (hi / lo) ** r.next(),
    gauss: () => {
      if (spare !== undefined) {
        const v = spare;
        spare = undefined;
        return v;
      }
      let u = 0, v = 0, q = 0;
      do {
        u = 2 * r.next() - 1;
        v = 2 * r.next() - 1;
        q = u * u + v * v;
      } while (q >= 1 || q === 0);
      const f = Math.sqrt((-2 * Math.log(q)) / q);
      spare = v * f;
      return u * f;
    },
    poisson: (mean) => {
      const limit = Math.exp(-mean);
      let k = 0;
      let p = r.next();
      while (p > limit) {
        k++;
        p *= r.next();
      }
      return k;
    },
    pick: (items) => items[Math.floor(r.next() * items.length)]!,
    chance: (p) => r.next() < p,
  };
  return r;
}
