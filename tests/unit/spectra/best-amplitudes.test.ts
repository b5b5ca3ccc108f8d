import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bestAmplitudes } from '../../../backend/src/spectra/bestAmplitudes';

/**
 * Reference non-negative least squares by cyclic coordinate descent on ½aᵀAa − rᵀa: each step sets
 * one amplitude to its exact non-negative minimiser with the others fixed; for a positive definite A
 * it converges to the unique optimum. Slow and simple, independent of the engine's subset search.
 */
function coordinateDescent(a: Float64Array, r: Float64Array, m: number): { x: Float64Array; reduction: number } {
  const x = new Float64Array(m);
  for (let sweep = 0; sweep < 20000; sweep++) {
    for (let j = 0; j < m; j++) {
      let g = r[j]!;
      for (let k = 0; k < m; k++) if (k !== j) g -= a[j * m + k]! * x[k]!;
      x[j] = Math.max(0, g / a[j * m + j]!);
    }
  }
  let reduction = 0;
  for (let j = 0; j < m; j++) {
    reduction += 2 * x[j]! * r[j]!;
    for (let k = 0; k < m; k++) reduction -= x[j]! * a[j * m + k]! * x[k]!;
  }
  return { x, reduction };
}

/** A = BᵀB + εI from a random 8×m B: a Gram matrix as the scan builds them (positive definite). */
const problem = (m: number) =>
  fc.tuple(
    fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 8 * m, maxLength: 8 * m }),
    fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: m, maxLength: m }),
  ).map(([b, r]) => {
    const a = new Float64Array(m * m);
    for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) {
      let s = p === q ? 0.05 : 0;
      for (let k = 0; k < 8; k++) s += b[k * m + p]! * b[k * m + q]!;
      a[p * m + q] = s;
    }
    return { a, r: Float64Array.from(r), m };
  });

describe('bestAmplitudes: non-negative least squares on the Gram matrix', () => {
  for (const m of [2, 3, 4, 5]) {
    it(`m = ${m}: the χ² reduction and amplitudes agree with coordinate descent`, () => {
      fc.assert(
        fc.property(problem(m), ({ a, r }) => {
          const amplitudes = new Float64Array(m);
          const reduction = bestAmplitudes(a, r, m, amplitudes);
          const ref = coordinateDescent(a, r, m);
          expect(reduction).toBeCloseTo(ref.reduction, 6);
          for (let j = 0; j < m; j++) {
            expect(amplitudes[j]!).toBeGreaterThanOrEqual(0);
            expect(amplitudes[j]!).toBeCloseTo(ref.x[j]!, 4);
          }
        }),
        { numRuns: 200, seed: 20261202 },
      );
    });
  }

  it('a component that only helps together with another is used (the last-component test is not a shortcut past it)', () => {
    // Components 0 and 3 are anti-correlated copies: alone, 3 projects negatively, but with 0 in
    // the fit it removes what 0 over-predicts.
    const m = 4;
    const a = Float64Array.from([2, 0, 0, -1.2, 0, 1, 0, 0, 0, 0, 1, 0, -1.2, 0, 0, 1]);
    const r = Float64Array.from([1, 0, 0, 0.2]);
    const amplitudes = new Float64Array(m);
    const reduction = bestAmplitudes(a, r, m, amplitudes);
    const ref = coordinateDescent(a, r, m);
    expect(amplitudes[3]!).toBeGreaterThan(0.1);
    expect(reduction).toBeCloseTo(ref.reduction, 8);
  });
});
