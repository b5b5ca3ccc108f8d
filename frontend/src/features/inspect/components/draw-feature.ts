import type { DisplayArrays } from '@/components/spectrum/use-display-arrays';
import { maskRuns } from '@/components/spectrum/mask-runs';
import { bandColumns } from '@/components/spectrum/band-columns';
import { columnBand, columnMinMax, columnX, pixelColumns } from '@/components/spectrum/pixel-columns';
import type { PixelColumns } from '@/components/spectrum/pixel-columns';
import { PLOT } from '@/components/spectrum/plot-palette';
import { lowerBound, robustRange } from '@/components/spectrum/robust-range';
import { velocityOf, windowSpan } from '../utils/feature-windows';
import type { FeatureWindow } from '../utils/feature-windows';

export const FEATURE_W = 220;
export const FEATURE_H = 120;
const PAD = { l: 4, r: 4, t: 4, b: 14 };

/**
 * Draws one close-up: flux (as shown above, smoothed or not), its band, masked pixels and the
 * expected positions; x in km/s from the feature's anchor at z. While every data pixel is at least
 * a screen column wide the flux is drawn as steps (a reader counts pixels across a doublet);
 * finer than that, each column shows the data's min/max and the band's envelope, so a panel
 * costs the same on a 100,000-pixel spectrum. The band is filled as rectangles, never as a
 * polygon of thousands of points (slow to rasterise in software).
 */
export function drawFeature(ctx: CanvasRenderingContext2D, f: FeatureWindow, z: number, halfWidth: number, d: DisplayArrays) {
  const W = FEATURE_W;
  const H = FEATURE_H;
  ctx.clearRect(0, 0, W, H);
  const [a, b] = windowSpan(f, z, halfWidth);
  const w = d.source.wavelength;
  const mask = d.source.mask;
  const i0 = Math.max(0, lowerBound(w, a) - 1);
  const i1 = Math.min(w.length, lowerBound(w, b) + 1);
  if (i1 - i0 < 1) return;
  const vMin = velocityOf(a, f.anchor, z);
  const vMax = velocityOf(b, f.anchor, z);
  const range = robustRange(d.flux, mask, i0, i1, 0, 1) ?? [-1, 1];
  const plotW = W - PAD.l - PAD.r;
  const toX = (lambda: number) => PAD.l + ((velocityOf(lambda, f.anchor, z) - vMin) / (vMax - vMin)) * plotW;
  const toY = (v: number) => PAD.t + (1 - (v - range[0]) / (range[1] - range[0])) * (H - PAD.t - PAD.b);
  const columns = Math.floor(plotW);
  const steps = i1 - i0 <= columns;

  ctx.save();
  ctx.beginPath();
  ctx.rect(PAD.l, 0, plotW, H);
  ctx.clip();

  ctx.fillStyle = PLOT.mask;
  const runs = maskRuns(w, mask, i0, i1, steps ? 0 : (b - a) / columns);
  for (let k = 0; k < runs.length; k += 2) {
    const x0 = toX(runs[k]!);
    ctx.fillRect(x0, PAD.t, Math.max(2, toX(runs[k + 1]!) - x0), H - PAD.t - PAD.b);
  }

  ctx.fillStyle = PLOT.errorBand;
  ctx.strokeStyle = PLOT.flux;
  ctx.lineWidth = 1;
  if (steps) drawSteps(ctx, d, i0, i1, toX, toY);
  else drawColumns(ctx, d, pixelColumns(w, i0, i1, a, b, columns), columns, toX, toY);
  ctx.restore();

  ctx.font = '9px "IBM Plex Mono", ui-monospace, monospace';
  ctx.strokeStyle = PLOT.emission;
  ctx.setLineDash([3, 2]);
  for (const m of f.marks) {
    const x = Math.round(toX(m.rest * (1 + z))) + 0.5;
    ctx.beginPath();
    ctx.moveTo(x, PAD.t);
    ctx.lineTo(x, H - PAD.b);
    ctx.stroke();
  }
  ctx.setLineDash([]);
  ctx.fillStyle = PLOT.axis;
  ctx.textBaseline = 'top';
  ctx.fillText(`${Math.round(vMin)}`, PAD.l, H - 11);
  const right = `+${Math.round(vMax)} km/s`;
  ctx.fillText(right, W - PAD.r - ctx.measureText(right).width, H - 11);
  // Where the feature's anchor lands at this z, top right on a paper ground.
  const observed = `${(f.anchor * (1 + z)).toFixed(1)} Å`;
  const width = ctx.measureText(observed).width;
  ctx.fillStyle = PLOT.labelGround;
  ctx.fillRect(W - PAD.r - width - 2, 1, width + 3, 11);
  ctx.fillStyle = PLOT.axis;
  ctx.fillText(observed, W - PAD.r - width - 0.5, 2);
}

/** Each pixel as a flat step from edge to edge (half-way to its neighbours), its band as a rectangle. */
function drawSteps(ctx: CanvasRenderingContext2D, d: DisplayArrays, i0: number, i1: number, toX: (l: number) => number, toY: (v: number) => number) {
  const w = d.source.wavelength;
  const mask = d.source.mask;
  const edgeLeft = (i: number) => (i > 0 ? toX((w[i]! + w[i - 1]!) / 2) : toX(w[i]!));
  const edgeRight = (i: number) => (i < w.length - 1 ? toX((w[i]! + w[i + 1]!) / 2) : toX(w[i]!));
  const error = d.source.error;
  for (let i = i0; i < i1; i++) {
    const f = d.flux[i]!;
    const e = error[i]!;
    if (mask[i] !== 0 || !Number.isFinite(f) || !Number.isFinite(e)) continue;
    const x0 = edgeLeft(i);
    const y0 = toY(f + Math.abs(e));
    ctx.fillRect(x0, y0, edgeRight(i) - x0, toY(f - Math.abs(e)) - y0);
  }
  ctx.beginPath();
  let pen = false;
  for (let i = i0; i < i1; i++) {
    const v = d.flux[i]!;
    if (mask[i] !== 0 || !Number.isFinite(v)) {
      pen = false;
      continue;
    }
    const y = toY(v);
    if (pen) ctx.lineTo(edgeLeft(i), y);
    else ctx.moveTo(edgeLeft(i), y);
    ctx.lineTo(edgeRight(i), y);
    pen = true;
  }
  ctx.stroke();
}

/** Many pixels per column: the band's envelope as one rectangle per column, the flux through each column's min and max. */
function drawColumns(ctx: CanvasRenderingContext2D, d: DisplayArrays, cols: PixelColumns, columns: number, toX: (l: number) => number, toY: (v: number) => number) {
  const mask = d.source.mask;
  const x = columnX(d.source.wavelength, cols);
  const top = new Float32Array(columns);
  const bottom = new Float32Array(columns);
  const band = columnBand(d.flux, d.source.error, cols, mask);
  bandColumns(x, band.low, band.high, (l) => toX(l) - PAD.l, (v) => v, columns, top, bottom);
  for (let c = 0; c < columns; c++) {
    if (Number.isNaN(top[c]!)) continue;
    // top/bottom hold flux values here (toY is applied per rectangle): the upper edge is the larger.
    const y0 = toY(bottom[c]!);
    ctx.fillRect(PAD.l + c, y0, 1, Math.max(1, toY(top[c]!) - y0));
  }
  const flux = columnMinMax(d.flux, cols, mask);
  ctx.beginPath();
  let pen = false;
  for (let k = 0; k < x.length; k++) {
    const v = flux[k];
    if (v == null) {
      pen = false;
      continue;
    }
    if (pen) ctx.lineTo(toX(x[k]!), toY(v));
    else ctx.moveTo(toX(x[k]!), toY(v));
    pen = true;
  }
  ctx.stroke();
}
