import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planAssignments } from '../../../backend/src/release/plan-assignments';

describe('planAssignments', () => {
  it('gives each spectrum two different readers, priority targets first, balancing load', () => {
    const spectra = [
      { spectrumId: 10, priority: 3, first: null, second: null },
      { spectrumId: 11, priority: 1, first: null, second: null },
      { spectrumId: 12, priority: null, first: null, second: null },
    ];
    const plan = planAssignments(spectra, [5, 6, 7], new Map());
    expect(plan.map((p) => `${p.spectrumId}:${p.readingOrder}:${p.readerId}`)).toEqual([
      '11:first:5',
      '11:second:6',
      '10:first:7',
      '10:second:5',
      '12:first:6',
      '12:second:7',
    ]);
  });

  it('keeps existing assignments and counts them as load', () => {
    const plan = planAssignments([{ spectrumId: 1, priority: 1, first: 5, second: null }], [5, 6, 7], new Map([[6, 4]]));
    expect(plan).toEqual([{ spectrumId: 1, readerId: 7, readingOrder: 'second' }]);
  });

  it('needs two readers', () => {
    expect(() => planAssignments([], [5, 5], new Map())).toThrow(/Two different readers/);
  });

  it('never gives one spectrum the same reader twice and keeps loads within one of each other', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.integer({ min: 2, max: 6 }), (n, r) => {
        const spectra = Array.from({ length: n }, (_, i) => ({ spectrumId: i + 1, priority: (i * 7) % 4 || null, first: null, second: null }));
        const readers = Array.from({ length: r }, (_, i) => 100 + i);
        const plan = planAssignments(spectra, readers, new Map());
        expect(plan).toHaveLength(2 * n);
        for (const s of spectra) {
          const mine = plan.filter((p) => p.spectrumId === s.spectrumId);
          expect(new Set(mine.map((p) => p.readerId)).size).toBe(2);
        }
        const loads = readers.map((x) => plan.filter((p) => p.readerId === x).length);
        expect(Math.max(...loads) - Math.min(...loads)).toBeLessThanOrEqual(1);
      }),
    );
  });
});
