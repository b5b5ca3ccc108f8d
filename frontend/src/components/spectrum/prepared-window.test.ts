import { describe, expect, it } from 'vitest';
import { displayWindow } from './display-window';
import { preparedWindow } from './prepared-window';
import type { DisplayArrays } from './use-display-arrays';

function display(pixels: number, model: Float32Array | null = null): DisplayArrays {
  const wavelength = Float64Array.from({ length: pixels }, (_, i) => 4000 + i);
  const flux = Float32Array.from({ length: pixels }, (_, i) => (i === 500 ? 100 : i % 7));
  return {
    source: { pixels, wavelength, flux, error: new Float32Array(pixels).fill(0.5), mask: new Uint8Array(pixels), sky: null, convertedFromAir: false, fluxUnit: null },
    flux,
    model,
  };
}

describe('preparedWindow', () => {
  it('gives the reduced window and the robust flux range of the pixels in it', () => {
    const d = display(1000);
    const p = preparedWindow(d, 4000, 4999, 100);
    expect(p.win).toEqual(displayWindow(d, 4000, 4999, 100));
    expect(p.win.exact).toBe(false);
    // Values 0…6 with one spike of 100: the 1st–99th percentiles are 0 and 6, padded by 8 % of 6.
    expect(p.yRange![0]).toBeCloseTo(-0.48, 6);
    expect(p.yRange![1]).toBeCloseTo(6.48, 6);
  });

  it('returns the same result for the same arrays, window and width, and computes anew when one differs', () => {
    const d = display(1000);
    const a = preparedWindow(d, 4000, 4999, 100);
    expect(preparedWindow({ ...d }, 4000, 4999, 100)).toBe(a);
    const narrower = preparedWindow(d, 4100, 4200, 100);
    expect(narrower).not.toBe(a);
    expect(narrower.win.exact).toBe(true);
    expect(narrower.win.x[0]).toBe(4099);
    const withModel = preparedWindow({ ...d, model: new Float32Array(1000).fill(2) }, 4100, 4200, 100);
    expect(withModel).not.toBe(narrower);
    expect(withModel.win.model[5]).toBe(2);
  });

  it('leaves the arrays as they were', () => {
    const d = display(1000);
    const before = Float32Array.from(d.flux);
    preparedWindow(d, 4000, 4999, 10);
    expect(d.flux).toEqual(before);
  });
});
