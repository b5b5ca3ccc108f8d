import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import type { Solution } from '../api/schemas';
import type { Chi2StripData } from '../utils/chi2-strip-data';
import { placeRankLabels } from '../utils/rank-labels';
import { DELTA_CHI2_CLIP, DELTA_CHI2_KNEE, DELTA_CHI2_TICKS, deltaChi2Height } from '../utils/delta-chi2-scale';
import { PLOT } from '@/components/spectrum/plot-palette';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';
import { CLASS_NAMES } from '@/lib/spectrum-class';
import { createOverlayCanvas } from '@/components/spectrum/overlay-canvas';

const HEIGHT = 170;
/** Rank numbers: one row's height and the least distance between two numbers on a row, px. */
const RANK_ROW_PX = 12;
const RANK_GAP_PX = 14;

/**
 * Δχ²(z) per class under the spectrum (delta-chi2-scale.ts: linear near the minima, compressed
 * and clipped far above them): dips are candidate redshifts. The solutions are marked with
 * their rank, the trial z is a cursor line on an overlay, and a click sets the trial z there.
 * The strip is built once and kept across spectra (new curves arrive through setData; only a
 * different set of classes rebuilds it); the cursor is moved by the compositor, once per frame.
 */
export function Chi2Strip({ data, solutions, store, onDraw }: { data: Chi2StripData; solutions: Solution[]; store: TrialZStore; onDraw?: ((u: uPlot) => void) | undefined }) {
  const host = useRef<HTMLDivElement>(null);
  const live = useRef({ solutions, store, data, onDraw });
  live.current.solutions = solutions;
  live.current.store = store;
  // An extra layer drawn with the strip (the target's photometric P(z), photo-z-layer.ts).
  live.current.onDraw = onDraw;
  const plot = useRef<{ u: uPlot; paint: () => void; moveCursor: () => void; shown: Chi2StripData } | null>(null);
  const classes = data.classes.join(' ');

  useEffect(() => {
    const el = host.current!;
    const { data } = live.current;
    let overlay: ReturnType<typeof createOverlayCanvas> | null = null;
    let plotRef: uPlot | null = null;
    // The solutions' marks are drawn on the overlay when the strip is drawn or the solutions change.
    const paintMarks = () => {
      const u = plotRef;
      if (!overlay || !u) return;
      overlay.paint((ctx, w, h) => {
        ctx.font = '10px "IBM Plex Mono", ui-monospace, monospace';
        ctx.textBaseline = 'top';
        ctx.strokeStyle = PLOT.solution;
        const xs = live.current.solutions.map((s) => Math.round(u.valToPos(s.z, 'x')) + 0.5);
        const labels = placeRankLabels(xs, w, RANK_GAP_PX);
        ctx.setLineDash([2, 2]);
        for (const l of labels) {
          ctx.beginPath();
          ctx.moveTo(l.x, 1 + l.row * RANK_ROW_PX + RANK_ROW_PX);
          ctx.lineTo(l.x, h);
          ctx.stroke();
        }
        ctx.setLineDash([]);
        // Each number on a paper ground, so the curves under the top of the strip do not hide it.
        for (const l of labels) {
          const text = String(l.rank);
          const tw = ctx.measureText(text).width;
          const y = 1 + l.row * RANK_ROW_PX;
          ctx.fillStyle = PLOT.labelGround;
          ctx.fillRect(l.x - tw / 2 - 2, y, tw + 4, RANK_ROW_PX - 1);
          ctx.fillStyle = PLOT.solution;
          ctx.fillText(text, l.x - tw / 2, y + 1);
        }
      });
    };
    // The trial-z cursor is an element of its own moved by a transform: following a drag then costs
    // the compositor a new offset, not a repaint and upload of a canvas as wide as the strip.
    const cursor = document.createElement('div');
    cursor.setAttribute('aria-hidden', 'true');
    cursor.style.cssText = `position:absolute;left:0;top:0;width:2px;height:100%;pointer-events:none;will-change:transform;background:${PLOT.cursor};`;
    let cursorX = Number.NaN;
    let cursorShown = true;
    const moveCursor = () => {
      const u = plotRef;
      if (!u) return;
      const x = Math.round(u.valToPos(live.current.store.get(), 'x'));
      // uPlot's plotting-area width (device px) rather than the element's, which would force a layout.
      const shown = x >= -1 && x <= u.bbox.width / (window.devicePixelRatio || 1);
      if (shown !== cursorShown) cursor.style.opacity = (cursorShown = shown) ? '1' : '0';
      if (shown && x !== cursorX) cursor.style.transform = `translateX(${(cursorX = x) - 0.5}px)`;
    };
    const paint = () => (paintMarks(), plotRef && live.current.onDraw?.(plotRef), moveCursor());
    const u = new uPlot(
      {
        width: el.clientWidth || 800,
        height: HEIGHT,
        legend: { show: false },
        cursor: { drag: { x: false, y: false }, points: { show: false }, y: false },
        // One fixed Δχ² scale for every spectrum, so depths compare from one spectrum to the next.
        scales: { x: { time: false }, y: { range: (): uPlot.Range.MinMax => [Y_RANGE[0], Y_RANGE[1]] } },
        // Curves one pixel wide: wider strokes of a jagged curve are far slower to rasterise in software.
        series: [{}, ...data.classes.map((c) => ({ label: c, stroke: PLOT.classes[c] ?? PLOT.axis, width: 1, spanGaps: false, points: { show: false } }))],
        axes: [
          { label: 'Redshift', stroke: PLOT.axis, grid: { stroke: PLOT.grid, width: 1 }, ticks: { stroke: PLOT.grid } },
          { label: 'Δχ²', stroke: PLOT.axis, grid: { stroke: PLOT.grid, width: 1 }, ticks: { stroke: PLOT.grid }, size: 64, splits: () => TICK_HEIGHTS.slice(), values: () => TICK_LABELS.slice() },
        ],
        hooks: { draw: [paint], setSize: [() => (overlay?.fit(), paint())] },
      },
      toData(data),
      el,
    );
    plotRef = u;
    plot.current = { u, paint, moveCursor, shown: data };
    overlay = createOverlayCanvas(u);
    u.over.appendChild(cursor);
    paint();
    const click = (e: MouseEvent) => live.current.store.set(u.posToVal(e.clientX - u.over.getBoundingClientRect().left, 'x'));
    u.over.addEventListener('click', click);
    const resize = new ResizeObserver(() => {
      const width = el.clientWidth;
      if (width > 0 && width !== u.width) u.setSize({ width, height: HEIGHT });
    });
    resize.observe(el);
    return () => {
      resize.disconnect();
      u.over.removeEventListener('click', click);
      u.destroy();
      plot.current = null;
    };
  }, [classes]);

  // New curves with the same classes (the next spectrum): new data, axes re-ranged, the same uPlot.
  useEffect(() => {
    live.current.data = data;
    const p = plot.current;
    if (!p || p.shown === data) return;
    p.shown = data;
    p.u.setData(toData(data), true);
  }, [data]);

  // The cursor follows the trial z (once per frame) and the marks follow the solutions.
  useEffect(() => {
    plot.current?.paint();
    return store.subscribe(() => plot.current?.moveCursor());
  }, [store, solutions, onDraw]);

  return (
    <figure className="isolate flex flex-col gap-1">
      <div ref={host} role="img" aria-label="χ² against z per class (a click moves the comb there)" className="w-full cursor-pointer" />
      <figcaption className="flex flex-wrap gap-x-4 text-xs text-ink-600">
        {data.classes.map((c) => (
          <span key={c} className="inline-flex items-center gap-1.5">
            <span aria-hidden="true" className="inline-block h-0.5 w-4" style={{ backgroundColor: PLOT.classes[c] ?? PLOT.axis }} />
            {CLASS_NAMES[c as keyof typeof CLASS_NAMES] ?? c}
          </span>
        ))}
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-3 w-0.5" style={{ backgroundColor: PLOT.cursor }} />
          trial z
        </span>
        <span>numbers: solutions by rank</span>
        <span className="basis-full">
          Δχ² = χ²(z) − χ² of the best fit (0 at the best): linear up to {DELTA_CHI2_KNEE}, compressed above, cut at {DELTA_CHI2_CLIP.toLocaleString('en')}. A dip is a candidate redshift; one more than {DELTA_CHI2_KNEE} above the best is strongly disfavoured (5σ for Gaussian errors).
        </span>
      </figcaption>
    </figure>
  );
}

const TICK_HEIGHTS = DELTA_CHI2_TICKS.map(deltaChi2Height);
const TICK_LABELS = DELTA_CHI2_TICKS.map((d) => (d === DELTA_CHI2_CLIP ? `≥${d.toLocaleString('en')}` : d.toLocaleString('en')));
const TOP = deltaChi2Height(DELTA_CHI2_CLIP);
const Y_RANGE: [number, number] = [-0.03 * TOP, 1.04 * TOP];

const toData = (d: Chi2StripData) => [d.z, ...d.series] as uPlot.AlignedData;
