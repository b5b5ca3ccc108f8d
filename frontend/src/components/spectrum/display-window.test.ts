import { describe, expect, it } from 'vitest';
import type { SpectrumArrays } from '@/lib/decode-spectrum-data';
import { displayWindow } from './display-window';
import type { DisplayArrays } from './use-display-arrays';

/** A spectrum on a log grid (60 km/s pixels from 3600 Å) with a sky, an error and a mask. */
function spectrum(n: number): DisplayArrays {
  const wavelength = Float64Array.from({ length: n }, (_, i) => 3600 * 10 ** (i * 8.7e-5));
  const flux = Float32Array.from({ length: n }, (_, i) => Math.sin(i / 7) + (i % 13 === 0 ? 0.5 : 0));
  const error = new Float32Array(n).fill(0.25);
  const sky = Float32Array.from({ length: n }, (_, i) => (i % 50 === 0 ? 9 : 0.1));
  const mask = new Uint8Array(n);
  const source: SpectrumArrays = { pixels: n, wavelength, flux, error, mask, sky, convertedFromAir: false, fluxUnit: null };
  return { source, flux, model: Float32Array.from(flux, (f) => f * 0.9) };
}

describe('displayWindow', () => {
  it('passes a small window through with its exact values (masked flux as gaps)', () => {
    const d = spectrum(500);
    d.source.mask[10] = 1;
    d.source.error[11] = Number.NaN;
    const w = d.source.wavelength;
    const win = displayWindow(d, w[0]!, w[499]!, 800);
    expect(win.exact).toBe(true);
    expect([...win.x]).toEqual([...w]);
    expect(win.flux[9]).toBe(d.flux[9]);
    expect(win.flux[10]).toBeNull();
    expect(win.bandLow[12]).toBeCloseTo(d.flux[12]! - 0.25, 6);
    expect(win.bandHigh[12]).toBeCloseTo(d.flux[12]! + 0.25, 6);
    // An unknown error closes the band onto the flux.
    expect(win.bandLow[11]).toBe(d.flux[11]);
    expect(win.sky[50]).toBe(d.source.sky![50]);
    expect(win.model[3]).toBe(d.model![3]);
    // The masked pixel is shaded from half-way to its neighbours.
    expect([...win.masked]).toEqual([(w[9]! + w[10]!) / 2, (w[10]! + w[11]!) / 2]);
  });

  it('keeps exact data up to two pixels per column, plus one pixel beyond each edge', () => {
    const d = spectrum(10_000);
    const w = d.source.wavelength;
    // Pixels 1000–2597 and one beyond each edge: 1,600 pixels for 800 columns.
    const win = displayWindow(d, w[1000]!, w[2597]!, 800);
    expect(win.exact).toBe(true);
    expect(win.x.length).toBe(1600);
    expect(win.x[0]).toBe(w[999]);
    expect(win.x[win.x.length - 1]).toBe(w[2598]);
    expect(displayWindow(d, w[1000]!, w[2598]!, 800).exact).toBe(false);
  });

  it('reduces 100,000 pixels to at most two points per column, keeping every column’s extremes', () => {
    const d = spectrum(100_000);
    d.flux[77_777] = 40; // a cosmic-ray-like spike
    d.source.mask[12_345] = 1;
    d.flux[12_345] = -500; // masked: must not show
    d.model![55_555] = 12;
    const w = d.source.wavelength;
    const win = displayWindow(d, w[0]!, w[99_999]!, 800);
    expect(win.exact).toBe(false);
    expect(win.x.length).toBeLessThanOrEqual(2 * 800 + 2);
    for (const series of [win.flux, win.bandLow, win.bandHigh, win.sky, win.model]) expect(series.length).toBe(win.x.length);
    const flux = win.flux.filter((v): v is number => v !== null);
    expect(Math.max(...flux)).toBe(40);
    expect(Math.min(...flux)).toBeCloseTo(-1, 2);
    expect(Math.max(...(win.sky as number[]))).toBeCloseTo(9, 5);
    expect(Math.max(...(win.model as number[]))).toBe(12);
    // The band reaches every pixel's flux ± σ: its top is the spike's + 0.25.
    expect(Math.max(...(win.bandHigh as number[]))).toBeCloseTo(40.25, 5);
    expect(Math.min(...(win.bandLow.filter((v) => v !== null) as number[]))).toBeGreaterThan(-2);
    // The stored arrays are untouched.
    expect(d.flux[12_345]).toBe(-500);
    expect(d.source.mask[12_345]).toBe(1);
  });

  it('shades masked stretches with at most one run per column when reduced', () => {
    const d = spectrum(100_000);
    for (let i = 0; i < 100_000; i += 7) d.source.mask[i] = 1; // a bad pixel in every column
    const w = d.source.wavelength;
    const win = displayWindow(d, w[0]!, w[99_999]!, 500);
    expect(win.masked.length / 2).toBeLessThanOrEqual(500);
    expect(win.masked[0]).toBe(w[0]);
    // Every column keeps the unmasked pixels' values: no gaps where some data are good.
    expect(win.flux.every((v) => v !== null)).toBe(true);
  });

  it('draws no model or sky when there is none', () => {
    const d = spectrum(50_000);
    const w = d.source.wavelength;
    const win = displayWindow({ ...d, model: null, source: { ...d.source, sky: null } }, w[0]!, w[49_999]!, 300);
    expect(win.model.every((v) => v === null)).toBe(true);
    expect(win.sky.every((v) => v === null)).toBe(true);
  });
});
