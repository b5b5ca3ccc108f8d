import { describe, expect, it } from 'vitest';
import { placeRankLabels } from './rank-labels';

describe('placeRankLabels', () => {
  it('keeps far-apart solutions on the top row, in rank order', () => {
    expect(placeRankLabels([300, 40, 600], 800, 14)).toEqual([
      { rank: 1, x: 300, row: 0 },
      { rank: 2, x: 40, row: 0 },
      { rank: 3, x: 600, row: 0 },
    ]);
  });

  it('moves a label that would print over a better-ranked one down a row, and back up when there is room', () => {
    const placed = placeRankLabels([100, 105, 110, 400, 103], 800, 14);
    expect(placed.map((l) => l.row)).toEqual([0, 1, 2, 0, 2]);
    // Rows are capped: a fourth crowded label shares the last row rather than leaving the strip.
    expect(placeRankLabels([100, 101, 102, 103], 800, 14, 3).map((l) => l.row)).toEqual([0, 1, 2, 2]);
  });

  it('leaves out solutions outside the visible z range', () => {
    expect(placeRankLabels([-5, 20, 900], 800, 14)).toEqual([{ rank: 2, x: 20, row: 0 }]);
  });
});
