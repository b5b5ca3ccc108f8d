import { describe, expect, it } from 'vitest';
import { bandColumns } from './band-columns';

describe('bandColumns', () => {
  it('fills the columns between two points with the straight band between them (the documented example)', () => {
    const top = new Float32Array(5);
    const bottom = new Float32Array(5);
    expect(bandColumns([0, 4], [0, 4], [2, 6], (v) => v, (v) => v, 5, top, bottom)).toBe(5);
    expect([...top]).toEqual([0, 1.5, 2.5, 3.5, 4]);
    expect([...bottom]).toEqual([2, 3.5, 4.5, 5.5, 6]);
  });

  it('takes the envelope of every point landing in one column, and leaves gaps open', () => {
    const top = new Float32Array(4);
    const bottom = new Float32Array(4);
    // Three points in column 0, a gap (null) over column 1–2, one point in column 3.
    const reached = bandColumns([0.1, 0.5, 0.9, 2, 3.2], [5, 1, 3, null, 0], [6, 2, 9, null, 1], (v) => v, (v) => v, 4, top, bottom);
    expect(reached).toBe(2);
    expect([top[0], bottom[0]]).toEqual([1, 9]);
    expect(Number.isNaN(top[1]!) && Number.isNaN(top[2]!)).toBe(true);
    expect([top[3], bottom[3]]).toEqual([0, 1]);
  });

  it('keeps columns outside 0 … width−1 out, and orders edges whatever way y runs', () => {
    const top = new Float32Array(2);
    const bottom = new Float32Array(2);
    // On a canvas y grows downwards: the upper edge maps to the smaller number.
    bandColumns([-3, 0.5, 1.5, 7], [1, 1, 2, 3], [2, 2, 4, 5], (v) => v, (v) => 10 - v, 2, top, bottom);
    expect([top[0], bottom[0]]).toEqual([8, 9]);
    expect([top[1], bottom[1]]).toEqual([6, 8]);
  });
});
