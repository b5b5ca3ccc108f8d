import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { layoutLabels } from './label-layout';

function run(labels: Array<{ left: number; width: number; priority: number }>, maxRows: number, gap = 4) {
  const n = labels.length;
  const rows = new Int8Array(n);
  const placed = layoutLabels(Float64Array.from(labels, (l) => l.left), Float64Array.from(labels, (l) => l.width), Float64Array.from(labels, (l) => l.priority), n, maxRows, rows, new Int32Array(n), gap);
  return { rows: Array.from(rows), placed };
}

const overlaps = (a: { left: number; width: number }, b: { left: number; width: number }, gap: number) => a.left < b.left + b.width + gap && b.left < a.left + a.width + gap;

describe('layoutLabels', () => {
  it('gives the documented example', () => {
    expect(run([{ left: 0, width: 30, priority: 1 }, { left: 10, width: 30, priority: 2 }, { left: 100, width: 30, priority: 1 }], 1)).toEqual({ rows: [-1, 0, 0], placed: 2 });
  });

  it('staggers crowded labels into rows before dropping any', () => {
    const labels = [0, 5, 10].map((left) => ({ left, width: 20, priority: 1 }));
    expect(run(labels, 3).rows).toEqual([0, 1, 2]);
    // With two rows the rightmost of three equal labels goes.
    expect(run(labels, 2).rows).toEqual([0, 1, -1]);
  });

  it('drops the lower-priority label, wherever it stands', () => {
    const labels = [
      { left: 0, width: 40, priority: 0.1 }, // TiO-like: weak in this class
      { left: 20, width: 40, priority: 0.9 },
      { left: 30, width: 40, priority: 0.5 },
    ];
    expect(run(labels, 2).rows).toEqual([-1, 0, 1]);
  });

  it('keeps the gap between neighbours on one row', () => {
    expect(run([{ left: 0, width: 10, priority: 1 }, { left: 13, width: 10, priority: 1 }], 1, 4).rows).toEqual([0, -1]);
    expect(run([{ left: 0, width: 10, priority: 1 }, { left: 14, width: 10, priority: 1 }], 1, 4).rows).toEqual([0, 0]);
  });

  const label = fc.record({ left: fc.double({ min: -50, max: 1200, noNaN: true }), width: fc.double({ min: 1, max: 120, noNaN: true }), priority: fc.integer({ min: 0, max: 5 }) });

  it('never places two boxes that overlap on one row, and drops a label only when every row is taken there by a label of at least its priority', () => {
    fc.assert(
      fc.property(fc.array(label, { maxLength: 80 }), fc.integer({ min: 1, max: 5 }), fc.integer({ min: 0, max: 8 }), (labels, maxRows, gap) => {
        const { rows, placed } = run(labels, maxRows, gap);
        expect(placed).toBe(rows.filter((r) => r >= 0).length);
        for (let i = 0; i < labels.length; i++) {
          expect(rows[i]).toBeGreaterThanOrEqual(-1);
          expect(rows[i]).toBeLessThan(maxRows);
          for (let j = i + 1; j < labels.length; j++) if (rows[i]! >= 0 && rows[i] === rows[j]) expect(overlaps(labels[i]!, labels[j]!, gap)).toBe(false);
          if (rows[i] === -1) {
            for (let r = 0; r < maxRows; r++) {
              const blocker = labels.some((b, j) => rows[j] === r && b.priority >= labels[i]!.priority && overlaps(labels[i]!, b, gap));
              expect(blocker).toBe(true);
            }
          }
        }
      }),
      { numRuns: 300, seed: 20261203 },
    );
  });
});
