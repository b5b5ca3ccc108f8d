import type { CombLine } from '@/lib/line-list';
import type { PlotLine } from './comb-lines';
import { layoutLabels } from './label-layout';
import { LABEL_FONT, PLOT } from './plot-palette';
import { SPEED_OF_LIGHT_KMS } from './velocity';

/**
 * Reusable buffers of one comb: it is redrawn on every frame of a drag and must not allocate per
 * line. After a draw they also hold what was drawn (markers, label boxes), which the plot reads
 * to list the lines under the pointer and to expose the label boxes to tests.
 */
export interface CombScratch {
  /** Marker x of each drawn line (CSS px), in the order drawn. */
  xs: Float64Array;
  /** Left edge and width of each line's label box (its paper ground), CSS px. */
  lefts: Float64Array;
  widths: Float64Array;
  priorities: Float64Array;
  /** Label row of each drawn line, −1 when its label was dropped. */
  rows: Int8Array;
  /** Index into the lines drawn. */
  order: Int32Array;
  layoutOrder: Int32Array;
  labelWidth: Map<string, number>;
  /** Lines drawn on the last paint (markers in view) and the list they index into. */
  count: number;
  lines: readonly CombLine[];
  /** Where the last paint put its label rows: y of row 0 and the direction rows go in. */
  rowTop: (row: number) => number;
  /** The caption's box when one was drawn (left, width; row 0), else null. */
  caption: { left: number; width: number; text: string } | null;
}

export const createCombScratch = (count: number): CombScratch => ({
  xs: new Float64Array(count + 1),
  lefts: new Float64Array(count + 1),
  widths: new Float64Array(count + 1),
  priorities: new Float64Array(count + 1),
  rows: new Int8Array(count + 1),
  order: new Int32Array(count + 1),
  layoutOrder: new Int32Array(count + 1),
  labelWidth: new Map(),
  count: 0,
  lines: [],
  rowTop: () => 0,
  caption: null,
});

export const ROW_HEIGHT = 12;
const MAX_ROWS = 4;
/** Least horizontal distance between two label boxes on one row, CSS px. */
const LABEL_GAP = 4;
/** Height of the tick that marks where the solution's template puts a line drawn off systemic. */
const OFFSET_TICK_PX = 16;

/**
 * How one comb looks. The inspection screen colours markers by kind; a plot with two combs (the
 * two readings of a disagreement) gives each comb one colour and its own label band, top or
 * bottom, so the two sets of names never interleave. Dash patterns still tell the kinds apart.
 */
export interface CombLook {
  colour: string | null;
  labels: 'top' | 'bottom';
  /** Label rows in the band (4 by default). */
  rows?: number;
  /** Text at the left of the first label row naming the comb (e.g. the reading's z). */
  caption?: string;
}

export const KIND_COLOURED: CombLook = { colour: null, labels: 'top' };

/** One label box as drawn, in CSS px of the overlay canvas. */
export interface LabelBox {
  text: string;
  left: number;
  top: number;
  width: number;
  height: number;
}

const priorityOf = (l: CombLine) => (l as Partial<PlotLine>).priority ?? 0;
const offsetOf = (l: CombLine) => (l as Partial<PlotLine>).offsetKms;

/**
 * Draws the comb at z on a transparent canvas covering the plotting area (CSS px, already scaled
 * for devicePixelRatio). `toX` maps an observed wavelength to CSS px. Labels are laid out by
 * priority (label-layout.ts): staggered into the band's rows, the least important dropped when
 * no row has room; a label that would run past the right edge goes to the left of its marker.
 */
export function drawComb(
  ctx: CanvasRenderingContext2D,
  lines: readonly CombLine[],
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
  // The caption is laid out as the first label, above every line's priority.
  s.caption = null;
  if (look.caption) {
    const w = textWidth(ctx, s, look.caption) + 2;
    s.lefts[0] = 2;
    s.widths[0] = w;
    s.priorities[0] = Infinity;
    s.caption = { left: 2, width: w, text: look.caption };
  }
  const first = s.caption ? 1 : 0;
  for (let i = 0; i < lines.length && count + first < s.xs.length; i++) {
    const l = lines[i]!;
    const x = toX(l.rest * k);
    const half = l.widthA ? Math.abs(toX((l.rest + l.widthA / 2) * k) - x) : 0;
    if (x + half < 0 || x - half > width) continue;
    const w = textWidth(ctx, s, l.name) + 2;
    const c = count + first;
    s.xs[count] = x;
    s.lefts[c] = x + 1 + w > width ? x - 1 - w : x + 1;
    s.widths[c] = w;
    s.priorities[c] = priorityOf(l);
    s.order[count] = i;
    count++;
  }
  s.count = count;
  s.lines = lines;
  const maxRows = look.rows ?? MAX_ROWS;
  // rows[0] is the caption's when there is one; the lines' rows follow (rows is read at c = index + first).
  layoutLabels(s.lefts, s.widths, s.priorities, count + first, maxRows, s.rows, s.layoutOrder, LABEL_GAP);
  const band = maxRows * ROW_HEIGHT + 2;
  const below = look.labels === 'bottom';
  // The marker spans the plot except the label band; labels sit in rows counted from their edge.
  const top = below ? 0 : band;
  const bottom = below ? height - band : height;
  const rowY = (row: number) => (below ? height - (row + 1) * ROW_HEIGHT : 1 + row * ROW_HEIGHT);
  s.rowTop = rowY;
  if (s.caption) {
    const y = rowY(s.rows[0]!);
    ctx.fillStyle = PLOT.labelGround;
    ctx.fillRect(s.caption.left, y, s.caption.width, ROW_HEIGHT - 1);
    ctx.fillStyle = look.colour ?? PLOT.axis;
    ctx.fillText(s.caption.text, s.caption.left + 1, y + 1);
  }
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
    const offset = offsetOf(l);
    if (offset !== undefined) {
      // Where the solution's template puts the line (Lyα of a Lyα emitter sits redward of systemic):
      // a short solid tick from the label band, so a reader dragging the comb onto the peak is not misled.
      const xo = Math.round(toX(l.rest * k * (1 + offset / SPEED_OF_LIGHT_KMS))) + 0.5;
      ctx.setLineDash([]);
      ctx.lineWidth = 2;
      ctx.beginPath();
      ctx.moveTo(xo, below ? bottom : top);
      ctx.lineTo(xo, below ? bottom - OFFSET_TICK_PX : top + OFFSET_TICK_PX);
      ctx.stroke();
    }
    const row = s.rows[c + first]!;
    if (row >= 0) {
      const y = rowY(row);
      const left = s.lefts[c + first]!;
      const w = s.widths[c + first]!;
      // A paper ground under the label keeps it legible over a noisy spectrum.
      ctx.fillStyle = PLOT.labelGround;
      ctx.fillRect(left, y, w, ROW_HEIGHT - 1);
      ctx.fillStyle = colour;
      ctx.fillText(l.name, left + 1, y + 1);
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

function textWidth(ctx: CanvasRenderingContext2D, s: CombScratch, text: string): number {
  let w = s.labelWidth.get(text);
  if (w === undefined) {
    w = ctx.measureText(text).width;
    s.labelWidth.set(text, w);
  }
  return w;
}

/** The label boxes the last drawComb with this scratch drew (made on demand, not per frame). */
export function drawnLabelBoxes(s: CombScratch): LabelBox[] {
  const out: LabelBox[] = [];
  const first = s.caption ? 1 : 0;
  if (s.caption && s.rows[0]! >= 0) out.push({ text: s.caption.text, left: s.caption.left, top: s.rowTop(s.rows[0]!), width: s.caption.width, height: ROW_HEIGHT - 1 });
  for (let c = 0; c < s.count; c++) {
    const row = s.rows[c + first]!;
    if (row < 0) continue;
    out.push({ text: s.lines[s.order[c]!]!.name, left: s.lefts[c + first]!, top: s.rowTop(row), width: s.widths[c + first]!, height: ROW_HEIGHT - 1 });
  }
  return out;
}

/** How many lines in view on the last paint have no label (no row had room). */
export function droppedLabels(s: CombScratch): number {
  const first = s.caption ? 1 : 0;
  let n = 0;
  for (let c = 0; c < s.count; c++) if (s.rows[c + first]! < 0) n++;
  return n;
}

/** A line drawn on the last paint, for the list under the pointer. */
export interface DrawnMarker {
  line: CombLine;
  x: number;
  labelled: boolean;
}

/** The markers within `slop` px of x, or whose label box holds (x, y), on the last paint with this scratch. */
export function markersAt(s: CombScratch, x: number, y: number, slop: number): DrawnMarker[] {
  const out: DrawnMarker[] = [];
  const first = s.caption ? 1 : 0;
  for (let c = 0; c < s.count; c++) {
    const row = s.rows[c + first]!;
    const left = s.lefts[c + first]!;
    const top = row >= 0 ? s.rowTop(row) : Number.NaN;
    const onLabel = row >= 0 && x >= left && x <= left + s.widths[c + first]! && y >= top && y <= top + ROW_HEIGHT;
    if (onLabel || Math.abs(s.xs[c]! - x) <= slop) out.push({ line: s.lines[s.order[c]!]!, x: s.xs[c]!, labelled: row >= 0 });
  }
  return out;
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
