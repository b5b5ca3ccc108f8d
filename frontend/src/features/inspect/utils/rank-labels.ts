/** Where one solution's rank number goes on the χ² strip: its x and the label row (0 = top). */
export interface RankLabel {
  rank: number;
  x: number;
  row: number;
}

/**
 * Rows for the rank numbers of solutions at screen positions `xs` (in rank order): each label sits
 * on the first row where it keeps `gap` pixels from every label already placed there, so solutions
 * a few pixels apart in z (a doublet read two ways, a Lyα/[O II] pair at low zoom) stay readable
 * instead of printing over each other. Better ranks are placed first and so keep the top row.
 * Labels outside [0, width] are left out.
 */
export function placeRankLabels(xs: readonly number[], width: number, gap: number, maxRows = 3): RankLabel[] {
  const rows: number[][] = [];
  const out: RankLabel[] = [];
  xs.forEach((x, i) => {
    if (!(x >= 0 && x <= width)) return;
    let row = rows.findIndex((placed) => placed.every((p) => Math.abs(p - x) >= gap));
    if (row < 0) row = rows.length < maxRows ? rows.length : maxRows - 1;
    (rows[row] ??= []).push(x);
    out.push({ rank: i + 1, x, row });
  });
  return out;
}
