import { describe, expect, it } from 'vitest';
import { photoZPriorOf } from '../../../backend/src/services/solution-prior';
import type { Solution } from '../../../backend/src/spectra/scanSpectrum';

const sol = (z: number, chi2: number): Solution => ({ z, zErr: 1e-4, reducedChi2: 1, class: 'galaxy', template: 't', chi2, deltaChi2: null, detectionChi2: 50, lines: [] });
const stored = [sol(0.5, 100), sol(3.1, 104)];
const noTyped = { photoZ: null, photoZLow: null, photoZHigh: null };
// Computed P(z) peaking at z = 0.5: it agrees with the scan's own best.
const pzLow = { z: [0, 0.5, 1, 2, 3, 4], p: [0, 2, 0.1, 0, 0, 0] };
// Computed P(z) peaking at z = 3.1.
const pzHigh = { z: [0, 1, 2, 3, 3.1, 4], p: [0, 0, 0, 0.5, 2, 0] };

describe('photoZPriorOf', () => {
  it('uses the typed photo-z over the computed P(z) when the target has both', () => {
    const prior = photoZPriorOf(stored, { photoZ: 3.0, photoZLow: 2.8, photoZHigh: 3.2 }, pzLow)!;
    expect(prior.source).toBe('typed');
    expect(prior.order).toEqual([1, 0]);
    expect(prior.movedTop).toBe(true);
    expect(prior.message).toBe('photo-z prior (catalogue photo-z) moved z = 3.1000 (scan rank 2) above z = 0.5000');
  });
  it('uses the computed P(z) when no typed photo-z exists', () => {
    const prior = photoZPriorOf(stored, noTyped, pzHigh)!;
    expect(prior.source).toBe('computed');
    expect(prior.order).toEqual([1, 0]);
    expect(prior.message).toBe('photo-z prior (computed P(z)) moved z = 3.1000 (scan rank 2) above z = 0.5000');
    const kept = photoZPriorOf(stored, noTyped, pzLow)!;
    expect(kept.order).toEqual([0, 1]);
    expect(kept.movedTop).toBe(false);
  });
  it('gives no prior (scan order stands) without a target, typed photo-z or usable P(z)', () => {
    expect(photoZPriorOf(stored, null, pzHigh)).toBeUndefined();
    expect(photoZPriorOf(stored, noTyped, null)).toBeUndefined();
    expect(photoZPriorOf(stored, noTyped, { z: [0, 1], p: [0, 0] })).toBeUndefined();
  });
  it('writes a star at z = −0.00001 as 0.0000, not −0.0000', () => {
    const prior = photoZPriorOf([sol(-0.00001, 50), sol(1.2, 400)], { photoZ: 0, photoZLow: 0, photoZHigh: 0.05 }, null)!;
    expect(prior.message).toBe("photo-z prior (catalogue photo-z) kept the scan's best solution z = 0.0000");
  });
});
