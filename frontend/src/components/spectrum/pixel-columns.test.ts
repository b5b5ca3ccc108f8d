import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { columnBand, columnMinMax, columnX, pixelColumns } from './pixel-columns';

/** A log-wavelength grid like an instrument's: `n` pixels from 3600 Å, `step` in log10 λ. */
const logGrid = (n: number, step = 1e-5) => Float64Array.from({ length: n }, (_, i) => 3600 * 10 ** (i * step));

describe('pixelColumns', () => {
  it('groups pixels by the screen column they fall in (the documented example)', () => {
    const cols = pixelColumns(Float64Array.of(0, 0.1, 0.2, 1.5, 2.5), 0, 5, 0, 3, 3);
    expect([...cols.starts.subarray(0, cols.count + 1)]).toEqual([0, 3, 4, 5]);
    expect(cols.count).toBe(3);
    expect(cols.points).toBe(4);
  });

  it('puts pixels outside the window in columns −1 and width, one group each side', () => {
    const x = Float64Array.of(-5, -4, 0.5, 1.5, 9, 10);
    const cols = pixelColumns(x, 0, 6, 0, 2, 2);
    expect([...cols.starts.subarray(0, cols.count + 1)]).toEqual([0, 2, 3, 4, 6]);
  });

  it('refuses an empty window or a width below one column', () => {
    expect(() => pixelColumns(Float64Array.of(1, 2), 0, 2, 5, 5, 10)).toThrow(RangeError);
    expect(() => pixelColumns(Float64Array.of(1, 2), 0, 2, 0, 5, 0.5)).toThrow(/at least one column/);
    expect(() => pixelColumns(Float64Array.of(1, 2), 0, 3, 0, 5, 10)).toThrow(/outside/);
  });
});

describe('columnMinMax', () => {
  it('keeps a one-pixel spike among 100,000 pixels drawn 800 columns wide', () => {
    const x = logGrid(100_000);
    const y = new Float32Array(100_000).fill(1);
    y[61_234] = 250;
    y[90_001] = -40;
    const cols = pixelColumns(x, 0, x.length, x[0]!, x[x.length - 1]!, 800);
    const out = columnMinMax(y, cols, null);
    expect(out.length).toBeLessThanOrEqual(2 * 800 + 2);
    expect(Math.max(...(out as number[]))).toBe(250);
    expect(Math.min(...(out as number[]))).toBe(-40);
    // The spike sits in the column of its wavelength, next to the column's baseline value.
    const xs = columnX(x, cols);
    const at = out.indexOf(250);
    expect(xs[at]).toBeGreaterThanOrEqual(x[61_234 - 200]!);
    expect(xs[at]).toBeLessThanOrEqual(x[61_234 + 200]!);
  });

  it('gives each column its min and max in the order they occur', () => {
    const x = Float64Array.of(0, 1, 2, 3, 4, 5, 6, 7);
    const y = Float32Array.of(5, 9, 1, 4, /* next column */ 2, 0, 3, 8);
    const cols = pixelColumns(x, 0, 8, 0, 8, 2);
    expect(columnMinMax(y, cols, null)).toEqual([9, 1, 0, 8]);
    expect([...columnX(x, cols)]).toEqual([0, 3, 4, 7]);
  });

  it('leaves masked and non-finite values out, and gives null where nothing is left', () => {
    const x = Float64Array.of(0, 1, 2, 3, 4, 5);
    const y = Float32Array.of(1, 1000, Number.NaN, Infinity, -Infinity, 7);
    const mask = Uint8Array.of(0, 1, 0, 0, 0, 0);
    const cols = pixelColumns(x, 0, 6, 0, 6, 2);
    // Column 0 holds pixels 0–2: the masked 1000 and the NaN are ignored; column 1 holds 3–5.
    expect(columnMinMax(y, cols, mask)).toEqual([1, 1, 7, 7]);
    expect(columnMinMax(Float32Array.of(1, 2, 3, 4, 5, 6), cols, Uint8Array.of(1, 1, 1, 0, 0, 0))).toEqual([null, null, 4, 6]);
  });

  it('matches a direct min/max of every column for any data (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.float({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }), { minLength: 2, maxLength: 400 }), fc.integer({ min: 1, max: 60 }), (values, width) => {
        const x = Float64Array.from(values, (_, i) => i);
        const y = Float32Array.from(values);
        const cols = pixelColumns(x, 0, x.length, 0, x.length - 1, width);
        const out = columnMinMax(y, cols, null);
        let o = 0;
        for (let k = 0; k < cols.count; k++) {
          const part = [...y.subarray(cols.starts[k]!, cols.starts[k + 1]!)];
          const got = part.length === 1 ? [out[o++]] : [out[o++], out[o++]];
          expect(Math.min(...(got as number[]))).toBe(Math.min(...part));
          expect(Math.max(...(got as number[]))).toBe(Math.max(...part));
        }
        expect(o).toBe(cols.points);
      }),
    );
  });
});

describe('columnBand', () => {
  it('covers every pixel’s flux ± σ in its column, with an unknown σ closing the band onto the flux', () => {
    const x = Float64Array.of(0, 1, 2, 3);
    const flux = Float32Array.of(10, 12, 3, 5);
    const error = Float32Array.of(1, 0.5, Number.NaN, 2);
    const cols = pixelColumns(x, 0, 4, 0, 4, 2);
    const band = columnBand(flux, error, cols, null);
    expect(band.low).toEqual([9, 9, 3, 3]);
    expect(band.high).toEqual([12.5, 12.5, 7, 7]);
  });

  it('ignores masked pixels and is null where a column has none left', () => {
    const x = Float64Array.of(0, 1, 2, 3);
    const cols = pixelColumns(x, 0, 4, 0, 4, 2);
    const band = columnBand(Float32Array.of(1, 100, 4, 4), Float32Array.of(1, 1, 1, 1), cols, Uint8Array.of(0, 1, 1, 1));
    expect(band.low).toEqual([0, 0, null, null]);
    expect(band.high).toEqual([2, 2, null, null]);
  });
});
