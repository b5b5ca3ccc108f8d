import FFT from 'fft.js';

/**
 * Cross-correlations c[ℓ] = Σ_i d[i]·x[i+ℓ] for ℓ = ℓ0 … ℓ0+count−1 (d and x zero-padded buffers of
 * one length N), either through FFTs — conj(D̂)·X̂ transformed back, two real correlations packed
 * into one complex inverse transform — or by the direct double loop. Both give the same numbers
 * (to round-off); the direct path exists for the benchmark and for tests.
 */
export interface ShiftCorrelator {
  readonly method: 'fft' | 'direct';
  readonly size: number;
  /** Prepares a real buffer of length `size` (its half spectrum, k = 0 … size/2, for the FFT path). */
  prepare(buffer: Float64Array): Float64Array;
  /**
   * Two correlations at once, each over its own lag window; the second may be omitted. Results go
   * into `out1` / `out2` when given (at least the window's count long), else into new arrays.
   */
  pair(d1: Float64Array, x1: Float64Array, w1: LagWindow, d2?: Float64Array, x2?: Float64Array, w2?: LagWindow, out1?: Float64Array, out2?: Float64Array): [Float64Array, Float64Array | undefined];
}

/** Lags ℓ0 … ℓ0 + count − 1 of a correlation. */
export interface LagWindow {
  l0: number;
  count: number;
}

const correlators = new Map<number, ShiftCorrelator>();

/** The FFT correlator for transforms of `size` points (a power of two), shared process-wide. */
export function fftCorrelator(size: number): ShiftCorrelator {
  let c = correlators.get(size);
  if (!c) {
    c = makeFftCorrelator(size);
    correlators.set(size, c);
  }
  return c;
}

function makeFftCorrelator(size: number): ShiftCorrelator {
  const f = new FFT(size);
  const product = new Float64Array(2 * size);
  const result = new Float64Array(2 * size);
  return {
    method: 'fft',
    size,
    prepare(buffer) {
      // Only the half spectrum k = 0 … N/2 is kept (the rest is its conjugate mirror, see pair).
      const out = new Float64Array(2 * size);
      f.realTransform(out as unknown as number[], buffer as unknown as number[]);
      return out.slice(0, size + 2);
    },
    pair(d1, x1, w1, d2, x2, w2, out1, out2) {
      const two = d2 !== undefined && x2 !== undefined && w2 !== undefined;
      // conj(D)·X of two real signals is Hermitian: A(N−k) = conj(A(k)). Each half-spectrum product
      // is computed once and the packed P = A₁ + i·A₂ is written at k and at N − k.
      const halfSize = size >> 1;
      for (let k = 0; k <= halfSize; k++) {
        const p = 2 * k;
        const ar = d1[p]!, ai = d1[p + 1]!, br = x1[p]!, bi = x1[p + 1]!;
        const re1 = ar * br + ai * bi;
        const im1 = ar * bi - ai * br;
        let re2 = 0;
        let im2 = 0;
        if (two) {
          const cr = d2[p]!, ci = d2[p + 1]!, er = x2[p]!, ei = x2[p + 1]!;
          re2 = cr * er + ci * ei;
          im2 = cr * ei - ci * er;
        }
        // P(k) = A₁ + i·A₂; P(N−k) = conj(A₁) + i·conj(A₂).
        product[p] = re1 - im2;
        product[p + 1] = im1 + re2;
        if (k > 0 && k < halfSize) {
          const q = 2 * (size - k);
          product[q] = re1 + im2;
          product[q + 1] = -im1 + re2;
        }
      }
      f.inverseTransform(result as unknown as number[], product as unknown as number[]);
      const c1 = out1 ?? new Float64Array(w1.count);
      for (let l = 0; l < w1.count; l++) c1[l] = result[2 * (w1.l0 + l)]!;
      if (!two) return [c1, undefined];
      const c2 = out2 ?? new Float64Array(w2.count);
      for (let l = 0; l < w2.count; l++) c2[l] = result[2 * (w2.l0 + l) + 1]!;
      return [c1, c2];
    },
  };
}

/** Direct O(N · count) correlator with the same interface (buffers used as they are). */
export function directCorrelator(size: number): ShiftCorrelator {
  const corr = (d: Float64Array, x: Float64Array, l0: number, count: number, into?: Float64Array) => {
    const out = into ?? new Float64Array(count);
    let first = 0;
    while (first < size && d[first] === 0) first++;
    let last = size - 1;
    while (last >= first && d[last] === 0) last--;
    let l = 0;
    // Four lags per pass over the data: each d[i] is loaded once for four products.
    for (; l + 4 <= count; l += 4) {
      const o = l0 + l;
      const end = Math.min(last, size - 4 - o);
      let a0 = 0, a1 = 0, a2 = 0, a3 = 0;
      for (let i = first; i <= end; i++) {
        const di = d[i]!;
        const j = i + o;
        a0 += di * x[j]!;
        a1 += di * x[j + 1]!;
        a2 += di * x[j + 2]!;
        a3 += di * x[j + 3]!;
      }
      // The last lags of the block may reach a few elements further than the first.
      for (let i = end + 1; i <= Math.min(last, size - 1 - o); i++) {
        const di = d[i]!;
        const j = i + o;
        a0 += di * x[j]!;
        if (j + 1 < size) a1 += di * x[j + 1]!;
        if (j + 2 < size) a2 += di * x[j + 2]!;
        if (j + 3 < size) a3 += di * x[j + 3]!;
      }
      out[l] = a0;
      out[l + 1] = a1;
      out[l + 2] = a2;
      out[l + 3] = a3;
    }
    for (; l < count; l++) {
      let acc = 0;
      const o = l0 + l;
      const end = Math.min(last, size - 1 - o);
      for (let i = first; i <= end; i++) acc += d[i]! * x[i + o]!;
      out[l] = acc;
    }
    return out;
  };
  return {
    method: 'direct',
    size,
    prepare: (b) => b,
    pair(d1, x1, w1, d2, x2, w2, out1, out2) {
      return [corr(d1, x1, w1.l0, w1.count, out1), d2 && x2 && w2 ? corr(d2, x2, w2.l0, w2.count, out2) : undefined];
    },
  };
}
