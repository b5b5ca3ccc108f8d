import { describe, expect, it } from 'vitest';
import { convertSmoothingWidth, MAX_SMOOTHING_PIXELS, smoothFlux, smoothingWidths } from './smooth';
import { pixelVelocitySummary, pixelVelocityWidths, SPEED_OF_LIGHT_KMS } from './velocity';

const C = SPEED_OF_LIGHT_KMS;

describe('pixelVelocityWidths', () => {
  it('gives c · Δλ / λ per pixel (the documented example)', () => {
    expect(pixelVelocityWidths(Float64Array.of(5000, 5001, 5002))[1]).toBeCloseTo((C * 2) / (2 * 5001), 9);
    // One-sided at the ends.
    expect(pixelVelocityWidths(Float64Array.of(5000, 5001, 5002))[0]).toBeCloseTo(C / 5000, 9);
  });

  it('is the same at every pixel of a log-wavelength grid: c · ln 10 · step', () => {
    const step = 1e-4; // log10 λ per pixel, the engine's grid: 69.03 km/s
    const grid = Float64Array.from({ length: 2000 }, (_, i) => 3600 * 10 ** (i * step));
    const dv = pixelVelocityWidths(grid);
    // The central difference over two pixels: c · (10^step − 10^−step) / 2 ≈ c · ln 10 · step.
    const expected = (C * (10 ** step - 10 ** -step)) / 2;
    expect(expected).toBeCloseTo(C * Math.LN10 * step, 2);
    for (const i of [1, 500, 1998]) expect(dv[i]).toBeCloseTo(expected, 6);
  });

  it('falls as 1/λ on a linear grid', () => {
    const grid = Float64Array.from({ length: 6001 }, (_, i) => 4000 + i); // 1 Å pixels, 4000–10000 Å
    const dv = pixelVelocityWidths(grid);
    expect(dv[1000]).toBeCloseTo(C / 5000, 9); // 59.96 km/s at 5000 Å
    expect(dv[6000 - 1]).toBeCloseTo(C / 9999, 9); // 29.98 km/s at 9999 Å
  });

  it('refuses a grid that does not increase, or of one pixel', () => {
    expect(() => pixelVelocityWidths(Float64Array.of(5000, 5000, 5001))).toThrow(/increase/);
    expect(() => pixelVelocityWidths(Float64Array.of(5000))).toThrow(/two pixels/);
  });

  it('summarises a linear grid by its narrowest and its median pixel', () => {
    const grid = Float64Array.from({ length: 6001 }, (_, i) => 4000 + i);
    const v = pixelVelocitySummary(grid);
    expect(v.min).toBeCloseTo(C / 10000, 9);
    expect(v.median).toBeCloseTo(C / 7000, 2);
  });
});

describe('smoothingWidths', () => {
  it('converts km/s to pixels with each pixel’s own velocity width (the documented example)', () => {
    const w = smoothingWidths({ kind: 'boxcar', width: 300, unit: 'km/s' }, Float64Array.of(5000, 5001, 5002)) as Float64Array;
    expect(w[1]).toBeCloseTo(300 / ((C * 2) / (2 * 5001)), 9);
    expect(w[1]).toBeCloseTo(5.0045, 4);
  });

  it('gives the same width everywhere on a log grid and a growing one towards the red on a linear grid', () => {
    const log = Float64Array.from({ length: 1000 }, (_, i) => 5000 * 10 ** (i * 1e-4));
    const onLog = smoothingWidths({ kind: 'gaussian', width: 345, unit: 'km/s' }, log) as Float64Array;
    expect(onLog[10]).toBeCloseTo(onLog[900]!, 6);
    expect(onLog[500]).toBeCloseTo(345 / (C * Math.LN10 * 1e-4), 3); // ≈ 5 pixels of 69 km/s
    const linear = Float64Array.from({ length: 6001 }, (_, i) => 4000 + i);
    const onLinear = smoothingWidths({ kind: 'boxcar', width: 300, unit: 'km/s' }, linear) as Float64Array;
    expect(onLinear[1000]).toBeCloseTo(300 / (C / 5000), 9); // 5.0 pixels at 5000 Å
    expect(onLinear[5000]).toBeCloseTo(300 / (C / 9000), 9); // 9.0 pixels at 9000 Å
  });

  it('keeps a width in pixels as it is, and cuts any width to the largest allowed', () => {
    expect(smoothingWidths({ kind: 'boxcar', width: 7, unit: 'pixels' }, Float64Array.of(1, 2))).toBe(7);
    expect(smoothingWidths({ kind: 'boxcar', width: 500, unit: 'pixels' }, Float64Array.of(1, 2))).toBe(MAX_SMOOTHING_PIXELS);
    const fine = Float64Array.from({ length: 100 }, (_, i) => 5000 * 10 ** (i * 1e-6)); // 0.69 km/s pixels
    expect((smoothingWidths({ kind: 'boxcar', width: 1000, unit: 'km/s' }, fine) as Float64Array)[50]).toBe(MAX_SMOOTHING_PIXELS);
    expect(() => smoothingWidths({ kind: 'boxcar', width: 0, unit: 'km/s' }, fine)).toThrow(RangeError);
  });

  it('carries a width between units at a given pixel velocity width', () => {
    expect(convertSmoothingWidth(5, 'pixels', 'km/s', 69)).toBe(345);
    expect(convertSmoothingWidth(345, 'km/s', 'pixels', 69)).toBe(5);
    expect(convertSmoothingWidth(5, 'pixels', 'pixels', 69)).toBe(5);
  });
});

describe('smoothFlux', () => {
  it('averages a boxcar (the documented example) without touching its input', () => {
    const flux = Float32Array.of(0, 3, 0);
    expect(smoothFlux(flux, new Uint8Array(3), 'boxcar', 3)[1]).toBe(1);
    expect([...flux]).toEqual([0, 3, 0]);
  });

  it('leaves masked and non-finite pixels out of every average', () => {
    const flux = Float32Array.of(1, 1, 1000, 1, Number.NaN, 1);
    const mask = Uint8Array.of(0, 0, 1, 0, 0, 0);
    const out = smoothFlux(flux, mask, 'boxcar', 3);
    expect([...out]).toEqual([1, 1, 1, 1, 1, 1]);
    const lonely = smoothFlux(Float32Array.of(5, 5, 5), Uint8Array.of(1, 1, 1), 'boxcar', 3);
    expect(Number.isNaN(lonely[1]!)).toBe(true);
  });

  it('uses a width per pixel: a wider boxcar where the width asks for it', () => {
    const flux = new Float32Array(20);
    flux[4] = 9;
    flux[11] = 9;
    const widths = Float64Array.from({ length: 20 }, (_, i) => (i < 8 ? 3 : 9));
    const out = smoothFlux(flux, new Uint8Array(20), 'boxcar', widths);
    expect(out[4]).toBe(3); // pixels 3–5: 9 / 3
    expect(out[11]).toBe(1); // pixels 7–15: 9 / 9
    expect(out[16]).toBe(0); // pixels 12–20: the spike is out of reach
  });

  it('smooths with a Gaussian of the given FWHM: a unit spike becomes the normalised kernel', () => {
    const flux = new Float32Array(41);
    flux[20] = 1;
    const fwhm = 6;
    const sigma = fwhm / (2 * Math.sqrt(2 * Math.LN2));
    const out = smoothFlux(flux, new Uint8Array(41), 'gaussian', fwhm);
    let norm = 0;
    for (let k = -Math.ceil(3 * sigma); k <= Math.ceil(3 * sigma); k++) norm += Math.exp(-0.5 * (k / sigma) ** 2);
    // Kernels are shared within 1 % of σ: the result is within 1 % of the exact one.
    expect(out[20]).toBeCloseTo(1 / norm, 2);
    expect(out[23]! / out[20]!).toBeCloseTo(Math.exp(-0.5 * (3 / sigma) ** 2), 1);
    expect(out[20]! > out[21]! && out[21]! > out[22]!).toBe(true);
    expect(out[19]).toBeCloseTo(out[21]!, 6);
  });
});
