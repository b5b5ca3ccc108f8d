import FFT from 'fft.js';

/**
 * Cross-correlations c[ℓ] = Σ_i d[i]·x[i+ℓ] for ℓ = 0 … lags−1 (d of length n, x of length
 * n + lags − 1), either through FFTs — conj(D̂)·X̂ transformed back, two real correlations
 * packed into one complex inverse transform — or by the direct double loop. Both give the same
 * numbers; the direct path exists for the benchmark and for tests.
 */
export interface ShiftCorrelator {
  readonly method: 'fft' | 'direct';
  /** Prepares a data vector (once per spectrum). */
  data(d: Float64Array): unknown;
  /** Prepares a template vector; `key` lets the FFT path reuse it across spectra. */
  template(x: Float64Array, key: string): unknown;
  /** Two correlations at once; the second pair may be omitted. */
  pair(d1: unknown, x1: unknown, d2: unknown | undefined, x2: unknown | undefined, lags: number): [Float64Array, Float64Array | undefined];
}

const ffts = new Map<number, FFT>();

/** FFT correlator for transforms of size `size` (a power of two ≥ n + lags − 1). */
export function fftCorrelator(size: number, cache: Map<string, Float64Array>): ShiftCorrelator {
  let fft = ffts.get(size);
  if (!fft) {
    fft = new FFT(size);
    ffts.set(size, fft);
  }
  const f = fft;
  const padded = new Float64Array(size);
  const spectrumOf = (v: Float64Array): Float64Array => {
    padded.fill(0);
    padded.set(v.subarray(0, Math.min(v.length, size)));
    const out = f.createComplexArray() as unknown as Float64Array;
    f.realTransform(out as unknown as number[], padded as unknown as number[]);
    f.completeSpectrum(out as unknown as number[]);
    return Float64Array.from(out);
  };
  const product = new Float64Array(2 * size);
  const result = new Float64Array(2 * size);
  return {
    method: 'fft',
    data: spectrumOf,
    template(x, key) {
      const full = `${size}|${key}`;
      let s = cache.get(full);
      if (!s) {
        if (cache.size > 4000) cache.clear();
        s = spectrumOf(x);
        cache.set(full, s);
      }
      return s;
    },
    pair(d1u, x1u, d2u, x2u, lags) {
      const d1 = d1u as Float64Array;
      const x1 = x1u as Float64Array;
      const d2 = d2u as Float64Array | undefined;
      const x2 = x2u as Float64Array | undefined;
      for (let k = 0; k < 2 * size; k += 2) {
        const ar = d1[k]!, ai = d1[k + 1]!, br = x1[k]!, bi = x1[k + 1]!;
        let re = ar * br + ai * bi;
        let im = ar * bi - ai * br;
        if (d2 && x2) {
          const cr = d2[k]!, ci = d2[k + 1]!, er = x2[k]!, ei = x2[k + 1]!;
          re -= cr * ei - ci * er;
          im += cr * er + ci * ei;
        }
        product[k] = re;
        product[k + 1] = im;
      }
      f.inverseTransform(result as unknown as number[], product as unknown as number[]);
      const c1 = new Float64Array(lags);
      const c2 = d2 && x2 ? new Float64Array(lags) : undefined;
      for (let l = 0; l < lags; l++) {
        c1[l] = result[2 * l]!;
        if (c2) c2[l] = result[2 * l + 1]!;
      }
      return [c1, c2];
    },
  };
}

/** Direct O(n · lags) correlator with the same interface. */
export function directCorrelator(): ShiftCorrelator {
  const corr = (d: Float64Array, x: Float64Array, lags: number) => {
    const out = new Float64Array(lags);
    const n = d.length;
    for (let l = 0; l < lags; l++) {
      let acc = 0;
      for (let i = 0; i < n; i++) acc += d[i]! * x[i + l]!;
      out[l] = acc;
    }
    return out;
  };
  return {
    method: 'direct',
    data: (d) => d,
    template: (x) => x,
    pair(d1, x1, d2, x2, lags) {
      return [
        corr(d1 as Float64Array, x1 as Float64Array, lags),
        d2 && x2 ? corr(d2 as Float64Array, x2 as Float64Array, lags) : undefined,
      ];
    },
  };
}
