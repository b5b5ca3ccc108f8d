import type { CombLine } from '@/lib/line-list';
import { staggerLabels } from './comb';
import { LABEL_FONT, PLOT } from './plot-palette';

/** Reusable buffers: the comb is redrawn on every frame of a drag and must not allocate per line. */
export interface CombScratch {
  xs: Float64Array;
  widths: Float64Array;
  rows: Int8Array;
  order: Int32Array;
  labelWidth: Map<string, number>;
}

export const createCombScratch = (count: number): CombScratch => ({
  xs: new Float64Array(count),
  widths: new Float64Array(count),
  rows: new Int8Array(count),
  order: new Int32Array(count),
  labelWidth: new Map(),
});

const ROW_HEIGHT = 12;
const MAX_ROWS = 4;

/**
 * How one comb looks. The inspection screen colours markers by kind; a plot with two combs (the
 * two readings of a disagreement) gives each comb one colour and its own label band, top or
 * bottom, so the two sets of names never interleave. Dash patterns still tell the kinds apart.
 */
export interface CombLook {
  colour: string | null;
  labels: 'top' | 'bottom';
}

export const KIND_COLOURED: CombLook = { colour: null, labels: 'top' };

/**
 * Draws the comb at z on a transparent canvas covering the plotting area (CSS px, already scaled
 * for devicePixelRatio). `toX` maps an observed wavelength to CSS px. Lines are sorted by rest
 * wavelength, so their observed positions come out sorted too and labels can be staggered.
 */
export function drawComb(
  ctx: CanvasRenderingContext2D,
  lines: CombLine[],
  z: number,
  toX: (lambda: number) => number,
  width: number,
  height: number,
  s: CombScratch,
  look: CombLook = KIND_COLOURED,
) {
  ctx.font = LABEL_FONT;
  ctx.textBaseline = 'top';
  const k = 1 + z;
  let count = 0;
  for (let i = 0; i < lines.length; i++) {
    const l = lines[i]!;
    const x = toX(l.rest * k);
    const half = l.widthA ? Math.abs(toX((l.rest + l.widthA / 2) * k) - x) : 0;
    if (x + half < 0 || x - half > width) continue;
    let w = s.labelWidth.get(l.name);
    if (w === undefined) {
      w = ctx.measureText(l.name).width;
      s.labelWidth.set(l.name, w);
    }
    s.xs[count] = x;
    s.widths[count] = w;
    s.order[count] = i;
    count++;
  }
  staggerLabels(s.xs, s.widths, count, s.rows, MAX_ROWS);
  const band = MAX_ROWS * ROW_HEIGHT + 2;
  const below = look.labels === 'bottom';
  // The marker spans the plot except the label band; labels sit in rows counted from their edge.
  const top = below ? 0 : band;
  const bottom = below ? height - band : height;
  const rowY = (row: number) => (below ? height - (row + 1) * ROW_HEIGHT : 1 + row * ROW_HEIGHT);
  for (let c = 0; c < count; c++) {
    const l = lines[s.order[c]!]!;
    const x = Math.round(s.xs[c]!) + 0.5;
    const colour = look.colour ?? (l.kind === 'emission' ? PLOT.emission : l.kind === 'absorption' ? PLOT.absorption : l.kind === 'break' ? PLOT.break : PLOT.bandLine);
    if (l.kind === 'band' && l.widthA) {
      const x0 = toX((l.rest - l.widthA / 2) * k);
      const x1 = toX((l.rest + l.widthA / 2) * k);
      ctx.fillStyle = PLOT.band;
      ctx.fillRect(x0, top, x1 - x0, bottom - top);
    }
    ctx.strokeStyle = colour;
    ctx.lineWidth = l.kind === 'break' ? 2 : 1;
    // Emission solid, absorption dashed, bands and breaks dotted: told apart without colour too.
    ctx.setLineDash(l.kind === 'emission' ? [] : l.kind === 'absorption' ? [5, 3] : [2, 3]);
    ctx.beginPath();
    ctx.moveTo(x, top);
    ctx.lineTo(x, bottom);
    ctx.stroke();
    const row = s.rows[c]!;
    if (row >= 0) {
      const y = rowY(row);
      // A paper ground under the label keeps it legible over a noisy spectrum.
      ctx.fillStyle = PLOT.labelGround;
      ctx.fillRect(x + 1, y, s.widths[c]! + 2, ROW_HEIGHT - 1);
      ctx.fillStyle = colour;
      ctx.fillText(l.name, x + 2, y + 1);
      ctx.setLineDash([1, 2]);
      ctx.lineWidth = 1;
      ctx.beginPath();
      ctx.moveTo(x, below ? y : y + ROW_HEIGHT - 1);
      ctx.lineTo(x, below ? bottom : top);
      ctx.stroke();
    }
  }
  ctx.setLineDash([]);
}

/** Detected emission peaks: small upward wedges on the bottom edge, where a click picks one. */
export function drawPeaks(ctx: CanvasRenderingContext2D, peaks: Array<{ wavelength: number }>, toX: (lambda: number) => number, width: number, height: number) {
  ctx.fillStyle = PLOT.peak;
  for (const p of peaks) {
    const x = toX(p.wavelength);
    if (x < 0 || x > width) continue;
    ctx.beginPath();
    ctx.moveTo(x, height - 11);
    ctx.lineTo(x - 5, height - 1);
    ctx.lineTo(x + 5, height - 1);
    ctx.closePath();
    ctx.fill();
  }
}
