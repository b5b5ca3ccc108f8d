/**
 * Rows for labels laid along one edge of a plot (comb line names): labels are taken from the
 * highest priority down and each goes to the first row where its box keeps `gap` px from every box
 * already on that row, so crowded labels stagger into rows first; a label that finds no row is
 * dropped (row −1) — by construction only ever for boxes of at least its own priority. Ties in
 * priority go left to right.
 *
 * `lefts` and `widths` give each label's box on the x axis (CSS px); `count` labels are read and
 * `rows` receives one row per label. `order` is scratch of at least `count` entries. Nothing is
 * allocated, so the comb can lay its labels out on every frame of a drag. Returns how many were
 * placed.
 *
 * @example layoutLabels(Float64Array.of(0, 10, 100), Float64Array.of(30, 30, 30), Float64Array.of(1, 2, 1), 3, 1, new Int8Array(3), new Int32Array(3)) // 2 (rows [-1, 0, 0])
 */
export function layoutLabels(
  lefts: Float64Array,
  widths: Float64Array,
  priorities: Float64Array,
  count: number,
  maxRows: number,
  rows: Int8Array,
  order: Int32Array,
  gap = 4,
): number {
  if (maxRows > 127) throw new RangeError(`At most 127 label rows (asked for ${maxRows}).`);
  for (let i = 0; i < count; i++) order[i] = i;
  // Insertion sort by priority (descending), then x: counts are small (the lines in view).
  for (let i = 1; i < count; i++) {
    const v = order[i]!;
    let j = i - 1;
    while (j >= 0 && before(v, order[j]!, priorities, lefts)) {
      order[j + 1] = order[j]!;
      j--;
    }
    order[j + 1] = v;
  }
  for (let i = 0; i < count; i++) rows[i] = -1;
  let placed = 0;
  for (let k = 0; k < count; k++) {
    const i = order[k]!;
    const a0 = lefts[i]!;
    const a1 = a0 + widths[i]!;
    for (let r = 0; r < maxRows; r++) {
      let free = true;
      // Only labels placed earlier (higher in `order`) hold a row yet.
      for (let m = 0; m < k && free; m++) {
        const j = order[m]!;
        if (rows[j] !== r) continue;
        const b0 = lefts[j]!;
        const b1 = b0 + widths[j]!;
        if (a0 < b1 + gap && b0 < a1 + gap) free = false;
      }
      if (free) {
        rows[i] = r;
        placed++;
        break;
      }
    }
  }
  return placed;
}

const before = (a: number, b: number, priorities: Float64Array, lefts: Float64Array) => priorities[a]! > priorities[b]! || (priorities[a] === priorities[b] && lefts[a]! < lefts[b]!);
