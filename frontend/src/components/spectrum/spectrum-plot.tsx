import { useEffect, useImperativeHandle, useRef } from 'react';
import type { Ref } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { CombLine } from '@/lib/line-list';
import type { DisplayArrays } from './use-display-arrays';
import { createCombScratch, drawComb, drawPeaks, KIND_COLOURED } from './draw-comb';
import type { CombLook } from './draw-comb';
import { dragZ } from './comb';
import { maskRuns } from './mask-runs';
import { PLOT } from './plot-palette';
import { decimalsFor, niceStep, restFrameSplits } from './rest-frame-axis';
import { lowerBound, robustRange } from './robust-range';
import type { TrialZStore } from './trial-z-store';
import { createOverlayCanvas } from './overlay-canvas';

export type PlotTool = 'comb' | 'zoom';

export interface PlotControls {
  resetZoom: () => void;
  /** factor < 1 zooms in around the centre. */
  zoomBy: (factor: number) => void;
  /** Shifts the window by a fraction of its width. */
  panBy: (fraction: number) => void;
}

/** One comb on the plot: its trial redshift and, when there are several, its own colour and label band. */
export interface PlotComb {
  store: TrialZStore;
  look?: CombLook;
}

interface Props {
  display: DisplayArrays;
  lines: CombLine[];
  /** The first comb is the one a comb drag moves and the rest-frame axis follows. Keep the array stable (memoise it). */
  combs: readonly PlotComb[];
  tool: PlotTool;
  restFrame: boolean;
  peaks?: Array<{ wavelength: number }>;
  onPeak?: (index: number) => void;
  controls?: Ref<PlotControls>;
  describedBy?: string;
  label?: string;
}

const NO_PEAKS: Array<{ wavelength: number }> = [];
const ignorePeak = () => {};

const HEIGHT = 340;
const CLICK_SLOP_PX = 3;
const PEAK_HIT_PX = 7;

/**
 * The spectrum with its error band, sky and masks, and the comb on its own overlay. uPlot is
 * created once per mount; a new spectrum or smoothing arrives through setData, zoom through
 * setScale, and a comb move repaints only the overlay.
 */
export function SpectrumPlot({ display, lines, combs, tool, restFrame, peaks = NO_PEAKS, onPeak = ignorePeak, controls, describedBy, label = 'Spectrum plot' }: Props) {
  const host = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  const live = useRef({ display, lines, peaks, tool, restFrame, onPeak, masks: maskRuns(display.source.wavelength, display.source.mask) });
  const paintComb = useRef<() => void>(() => {});
  live.current.lines = lines;
  live.current.peaks = peaks;
  live.current.tool = tool;
  live.current.onPeak = onPeak;
  const store = combs[0]!.store;

  useImperativeHandle(controls, () => ({
    resetZoom: () => {
      const u = plot.current;
      const w = live.current.display.source.wavelength;
      if (u && w.length) u.setScale('x', { min: w[0]!, max: w[w.length - 1]! });
    },
    zoomBy: (factor) => {
      const u = plot.current;
      if (!u) return;
      const [min, max] = xWindow(u);
      const mid = (min + max) / 2;
      const half = ((max - min) / 2) * factor;
      u.setScale('x', { min: mid - half, max: mid + half });
    },
    panBy: (fraction) => {
      const u = plot.current;
      if (!u) return;
      const [min, max] = xWindow(u);
      const d = (max - min) * fraction;
      u.setScale('x', { min: min + d, max: max + d });
    },
  }));

  useEffect(() => {
    const el = host.current!;
    const scratch = createCombScratch(512);
    let overlay: ReturnType<typeof createOverlayCanvas> | null = null;
    let frame = 0;

    const repaint = () => {
      const u = plot.current;
      if (!u || !overlay) return;
      const toX = (lambda: number) => u.valToPos(lambda, 'x');
      const { lines, peaks } = live.current;
      overlay.paint((ctx, w, h) => {
        for (const comb of combs) drawComb(ctx, lines, comb.store.get(), toX, w, h, scratch, comb.look ?? KIND_COLOURED);
        drawPeaks(ctx, peaks, toX, w, h);
      });
    };
    paintComb.current = repaint;
    const scheduleRepaint = () => {
      if (!frame) frame = requestAnimationFrame(() => ((frame = 0), repaint()));
    };

    const yRange = (u: uPlot): uPlot.Range.MinMax => {
      const { flux, source } = live.current.display;
      const w = source.wavelength;
      const i0 = lowerBound(w, xWindow(u)[0]);
      const i1 = lowerBound(w, xWindow(u)[1]);
      return robustRange(flux, source.mask, i0, Math.max(i1, i0 + 1)) ?? [-1, 1];
    };

    const drawMasks = (u: uPlot) => {
      const runs = live.current.masks;
      const { top, height } = u.bbox;
      u.ctx.save();
      u.ctx.fillStyle = PLOT.mask;
      for (let i = 0; i < runs.length; i += 2) {
        const x0 = u.valToPos(runs[i]!, 'x', true);
        const x1 = u.valToPos(runs[i + 1]!, 'x', true);
        if (x1 < u.bbox.left || x0 > u.bbox.left + u.bbox.width) continue;
        u.ctx.fillRect(x0, top, Math.max(2 * devicePixelRatio, x1 - x0), height);
      }
      u.ctx.restore();
    };

    // Masked pixels are drawn as gaps in the flux and its band (the shading says why); the arrays keep their values.
    const maskGaps = (u: uPlot, _series: number, _i0: number, _i1: number, nullGaps: uPlot.Series.Gaps): uPlot.Series.Gaps => {
      const runs = live.current.masks;
      if (runs.length === 0) return nullGaps;
      const out: uPlot.Series.Gaps = nullGaps.slice();
      for (let i = 0; i < runs.length; i += 2) out.push([Math.floor(u.valToPos(runs[i]!, 'x', true)), Math.ceil(u.valToPos(runs[i + 1]!, 'x', true))]);
      return out.sort((a, b) => a[0] - b[0]);
    };

    const xSplits = (u: uPlot, _axis: number, min: number, max: number, incr: number) => {
      if (!live.current.restFrame) {
        const out: number[] = [];
        for (let v = Math.ceil(min / incr) * incr; v <= max; v += incr) out.push(v);
        return out;
      }
      return restFrameSplits(min, max, store.get(), Math.max(3, Math.floor(u.bbox.width / devicePixelRatio / 90)));
    };
    const xValues = (_u: uPlot, splits: number[]) => {
      if (splits.length === 0) return [];
      const k = live.current.restFrame ? 1 + store.get() : 1;
      const step = splits.length > 1 ? (splits[1]! - splits[0]!) / k : 1;
      const d = decimalsFor(niceStep(step));
      return splits.map((v) => (v / k).toFixed(d));
    };

    const u = new uPlot(
      {
        width: el.clientWidth || 800,
        height: HEIGHT,
        legend: { show: false },
        scales: { x: { time: false }, y: { range: yRange } },
        cursor: { drag: { x: true, y: false, setScale: true }, points: { show: false }, y: false },
        series: [
          {},
          { label: 'flux − 1σ', stroke: 'transparent', points: { show: false }, gaps: maskGaps },
          { label: 'flux + 1σ', stroke: 'transparent', points: { show: false }, gaps: maskGaps },
          { label: 'sky', stroke: PLOT.sky, width: 1, points: { show: false }, show: display.source.sky !== null },
          { label: 'flux', stroke: PLOT.flux, width: 1, points: { show: false }, gaps: maskGaps },
          { label: 'model', stroke: PLOT.model, width: 1.5, points: { show: false }, show: display.hasModel },
        ],
        bands: [{ series: [2, 1], fill: PLOT.errorBand }],
        axes: [
          { label: axisLabel(false), stroke: PLOT.axis, grid: { stroke: PLOT.grid, width: 1 }, ticks: { stroke: PLOT.grid }, splits: xSplits, values: xValues },
          { label: 'Flux', stroke: PLOT.axis, grid: { stroke: PLOT.grid, width: 1 }, ticks: { stroke: PLOT.grid }, size: 64 },
        ],
        hooks: {
          drawClear: [drawMasks],
          draw: [repaint],
          setSize: [() => (overlay?.fit(), repaint())],
        },
      },
      toData(display),
      el,
    );
    plot.current = u;
    overlay = createOverlayCanvas(u);
    repaint();

    const unsubscribes = combs.map((c) => c.store.subscribe(scheduleRepaint));
    const detachPointer = attachPointer(u, store, live, scheduleRepaint);
    const resize = new ResizeObserver(() => {
      const width = el.clientWidth;
      if (width > 0 && width !== u.width) u.setSize({ width, height: HEIGHT });
    });
    resize.observe(el);

    return () => {
      cancelAnimationFrame(frame);
      for (const off of unsubscribes) off();
      detachPointer();
      resize.disconnect();
      u.destroy();
      plot.current = null;
    };
    // uPlot is built once per set of combs (per spectrum); later props reach it through `live` and the effects below.
  }, [combs, store]);

  // New spectrum: new data and the full range. New smoothing only: same window, y re-ranged.
  const shown = useRef(display);
  useEffect(() => {
    const u = plot.current;
    // The first display is the one uPlot was built with (its scales are still being set up).
    if (!u || shown.current === display) return;
    const sameSpectrum = shown.current.source === display.source;
    shown.current = display;
    live.current.display = display;
    if (!sameSpectrum) live.current.masks = maskRuns(display.source.wavelength, display.source.mask);
    u.setSeries(3, { show: display.source.sky !== null });
    u.setSeries(5, { show: display.hasModel });
    if (sameSpectrum) {
      const [min, max] = xWindow(u);
      u.setData(toData(display), false);
      u.setScale('x', { min, max });
    } else {
      u.setData(toData(display), true);
    }
  }, [display]);

  useEffect(() => {
    live.current.restFrame = restFrame;
    const u = plot.current;
    if (!u) return;
    u.axes[0]!.label = axisLabel(restFrame);
    u.redraw(false, true);
  }, [restFrame]);

  // The rest-frame axis follows the trial z once a move settles (relabelling every frame would redraw the series).
  useEffect(() => {
    if (!restFrame) return;
    let timer = 0;
    const unsubscribe = store.subscribe(() => {
      clearTimeout(timer);
      timer = window.setTimeout(() => plot.current?.redraw(false, true), 120);
    });
    return () => (clearTimeout(timer), unsubscribe());
  }, [restFrame, store]);

  useEffect(() => paintComb.current(), [lines, peaks]);

  return (
    <div
      ref={host}
      role="group"
      aria-label={label}
      aria-describedby={describedBy}
      tabIndex={0}
      className={`spectrum-plot relative w-full select-none rounded-control ${tool === 'comb' ? 'cursor-ew-resize' : 'cursor-crosshair'}`}
    />
  );
}

/** The visible wavelength window (uPlot keeps it on the x scale). */
const xWindow = (u: uPlot): [number, number] => {
  const { min, max } = u.scales.x!;
  if (min != null && max != null) return [min, max];
  // Before uPlot's first commit the scale is unset: the data's own extent is the window.
  const w = u.data[0];
  return [w[0] ?? 0, w[w.length - 1] ?? 1];
};

const axisLabel = (rest: boolean) => (rest ? 'Rest-frame wavelength at the trial z (Å, vacuum)' : 'Observed wavelength (Å, vacuum)');

const toData = (d: DisplayArrays): uPlot.AlignedData => [d.source.wavelength, d.bandLow, d.bandHigh, d.sky, d.flux, d.model];

type Live = { current: { tool: PlotTool; peaks: Array<{ wavelength: number }>; onPeak: (index: number) => void; display: DisplayArrays } };

/**
 * Pointer handling on the plotting area: with the comb tool a drag moves the comb (the marker
 * under the pointer follows it); Shift + drag pans with either tool; the wheel zooms around the
 * pointer. Cancelling pointerdown keeps uPlot's own drag-select out of comb drags and pans.
 */
function attachPointer(u: uPlot, store: TrialZStore, live: Live, repaint: () => void): () => void {
  const over = u.over;
  let mode: 'none' | 'comb' | 'pan' = 'none';
  let startX = 0;
  let startLambda = 0;
  let startZ = 0;
  let startMin = 0;
  let startMax = 0;
  let moved = false;

  const localX = (e: PointerEvent | WheelEvent) => e.clientX - over.getBoundingClientRect().left;

  const down = (e: PointerEvent) => {
    if (e.button !== 0) return;
    const comb = live.current.tool === 'comb';
    if (!comb && !e.shiftKey) return;
    e.preventDefault();
    (over.closest('[role="group"]') as HTMLElement | null)?.focus({ preventScroll: true });
    over.setPointerCapture(e.pointerId);
    mode = e.shiftKey ? 'pan' : 'comb';
    startX = localX(e);
    startLambda = u.posToVal(startX, 'x');
    startZ = store.get();
    [startMin, startMax] = xWindow(u);
    moved = false;
  };

  const move = (e: PointerEvent) => {
    if (mode === 'none') return;
    const x = localX(e);
    if (Math.abs(x - startX) > CLICK_SLOP_PX) moved = true;
    if (!moved) return;
    if (mode === 'comb') store.set(dragZ(startZ, startLambda, u.posToVal(x, 'x')));
    else {
      const perPx = (startMax - startMin) / u.over.clientWidth;
      const d = (startX - x) * perPx;
      u.setScale('x', { min: startMin + d, max: startMax + d });
    }
  };

  const up = (e: PointerEvent) => {
    if (mode === 'comb' && !moved) {
      // A click without a drag on a detected peak offers the lines it could be.
      const x = localX(e);
      const peaks = live.current.peaks;
      let best = -1;
      let bestD = PEAK_HIT_PX;
      for (let i = 0; i < peaks.length; i++) {
        const d = Math.abs(u.valToPos(peaks[i]!.wavelength, 'x') - x);
        if (d < bestD) (best = i), (bestD = d);
      }
      if (best >= 0) live.current.onPeak(best);
    }
    mode = 'none';
    repaint();
  };

  let wheelFrame = 0;
  let wheelFactor = 1;
  let wheelAt = 0;
  const wheel = (e: WheelEvent) => {
    e.preventDefault();
    wheelFactor *= Math.exp(e.deltaY * 0.0015);
    wheelAt = localX(e);
    if (wheelFrame) return;
    wheelFrame = requestAnimationFrame(() => {
      wheelFrame = 0;
      const [min, max] = xWindow(u);
      const at = u.posToVal(wheelAt, 'x');
      const w = live.current.display.source.wavelength;
      const full = w[w.length - 1]! - w[0]!;
      const span = Math.min(full * 1.05, Math.max(full * 1e-4, (max - min) * wheelFactor));
      const left = (at - min) / (max - min);
      wheelFactor = 1;
      u.setScale('x', { min: at - left * span, max: at + (1 - left) * span });
    });
  };

  over.addEventListener('pointerdown', down);
  over.addEventListener('pointermove', move);
  over.addEventListener('pointerup', up);
  over.addEventListener('pointercancel', up);
  over.addEventListener('wheel', wheel, { passive: false });
  return () => {
    cancelAnimationFrame(wheelFrame);
    over.removeEventListener('pointerdown', down);
    over.removeEventListener('pointermove', move);
    over.removeEventListener('pointerup', up);
    over.removeEventListener('pointercancel', up);
    over.removeEventListener('wheel', wheel);
  };
}
