import { describe, expect, it } from 'vitest';
import { maskRuns } from './mask-runs';

describe('maskRuns', () => {
  it('widens each run of bad pixels to the pixel edges (the documented example)', () => {
    expect([...maskRuns(Float64Array.of(1, 2, 3, 4, 5), Uint8Array.of(0, 1, 0, 1, 0))]).toEqual([1.5, 2.5, 3.5, 4.5]);
    expect([...maskRuns(Float64Array.of(1, 2, 3), Uint8Array.of(1, 1, 0))]).toEqual([1, 2.5]);
  });

  it('looks only at pixels [i0, i1) and merges runs closer than joinWithin', () => {
    const w = Float64Array.of(1, 2, 3, 4, 5, 6, 7, 8);
    const m = Uint8Array.of(1, 0, 1, 0, 1, 0, 0, 1);
    expect([...maskRuns(w, m, 2, 7)]).toEqual([2.5, 3.5, 4.5, 5.5]);
    expect([...maskRuns(w, m, 0, 8, 1.5)]).toEqual([1, 5.5, 7.5, 8]);
  });
});
