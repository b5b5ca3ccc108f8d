import { useEffect, useImperativeHandle, useRef } from 'react';
import type { Ref } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { CombLine } from '@/lib/line-list';
import type { DisplayArrays } from './use-display-arrays';
import { bandColumns } from './band-columns';
import { createCombScratch, drawComb, drawnLabelBoxes, drawPeaks, droppedLabels, KIND_COLOURED, markersAt } from './draw-comb';
import type { CombLook, CombScratch, DrawnMarker } from './draw-comb';
import { dragZ } from './comb';
import type { WindowArrays } from './display-window';
import { preparedWindow } from './prepared-window';
import { fluxAxis, fluxTicks } from './flux-axis';
import type { FluxAxis } from './flux-axis';
import { robustRange } from './robust-range';
import { PLOT } from './plot-palette';
import { decimalsFor, niceStep, restFrameSplits } from './rest-frame-axis';
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
  /** This comb's own lines (e.g. those a reading used); else the plot's `lines`. */
  lines?: readonly CombLine[];
}

interface Props {
  display: DisplayArrays;
  /**
   * What is likely shown next (the next spectrum in a queue), made on demand: in idle time the
   * plot makes it (smoothing it if need be) and reduces its whole range for its own width.
   */
  upcoming?: (() => DisplayArrays) | null;
  lines: readonly CombLine[];
  /** The first comb is the one a comb drag moves and the rest-frame axis follows. Keep the array stable (memoise it). */
  combs: readonly PlotComb[];
  tool: PlotTool;
  restFrame: boolean;
  /** Draw the sky spectrum when the file has one (default true). */
  showSky?: boolean;
  peaks?: Array<{ wavelength: number }>;
  onPeak?: (index: number) => void;
  controls?: Ref<PlotControls>;
  describedBy?: string;
  label?: string;
}

const NO_PEAKS: Array<{ wavelength: number }> = [];
// Until the plot is built: the axis of no spectrum (replaced before the first draw).
const NO_FLUX_AXIS: { source: DisplayArrays['source'] | null; axis: FluxAxis } = { source: null, axis: { factor: 1, label: 'Flux' } };
const ignorePeak = () => {};

const HEIGHT = 340;
const CLICK_SLOP_PX = 3;
const PEAK_HIT_PX = 7;
// uPlot series after x: the order the arrays of a window go in (see toData).
const SKY = 1;
const MODEL = 3;

type Window = [number, number];

/**
 * The spectrum with its error band, sky and masks, and the comb on its own overlay. uPlot is
 * created once per mount. Every change of the x window (zoom, pan, a new spectrum or smoothing,
 * a resize) goes through one function that hands uPlot the window's arrays reduced to at most
 * two points per screen column (display-window.ts), so drawing costs the same on 4,000 pixels as
 * on 100,000. A comb move repaints only the overlay.
 */
export function SpectrumPlot({ display, upcoming = null, lines, combs, tool, restFrame, showSky = true, peaks = NO_PEAKS, onPeak = ignorePeak, controls, describedBy, label = 'Spectrum plot' }: Props) {
  const host = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  const live = useRef({ display, lines, combs, peaks, tool, restFrame, showSky, onPeak, view: fullRange(display), win: null as WindowArrays | null, yRange: null as [number, number] | null, columns: 0, flux: NO_FLUX_AXIS as ReturnType<typeof fluxAxisOf> });
  const paintComb = useRef<() => void>(() => {});
  const showWindow = useRef<(view: Window) => void>(() => {});
  live.current.lines = lines;
  live.current.combs = combs;
  live.current.peaks = peaks;
  live.current.tool = tool;
  live.current.onPeak = onPeak;
  live.current.showSky = showSky;
  const store = combs[0]!.store;

  useImperativeHandle(controls, () => ({
    resetZoom: () => showWindow.current(fullRange(live.current.display)),
    zoomBy: (factor) => {
      const [min, max] = live.current.view;
      const mid = (min + max) / 2;
      const half = ((max - min) / 2) * factor;
      showWindow.current([mid - half, mid + half]);
    },
    panBy: (fraction) => {
      const [min, max] = live.current.view;
      const d = (max - min) * fraction;
      showWindow.current([min + d, max + d]);
    },
  }));

  useEffect(() => {
    const el = host.current!;
    // One set of buffers per comb: after a paint each holds what its comb drew (for hover and tests).
    const scratches: CombScratch[] = [];
    const scratchOf = (i: number) => (scratches[i] ??= createCombScratch(512));
    const trialZ = () => live.current.combs[0]!.store.get();
    let overlay: ReturnType<typeof createOverlayCanvas> | null = null;
    let bandTop = new Float32Array(0);
    let bandBottom = new Float32Array(0);

    const repaint = () => {
      const u = plot.current;
      if (!u || !overlay) return;
      const toX = (lambda: number) => u.valToPos(lambda, 'x');
      const { lines, peaks, combs } = live.current;
      overlay.paint((ctx, w, h) => {
        combs.forEach((comb, i) => drawComb(ctx, comb.lines ?? lines, comb.store.get(), toX, w, h, scratchOf(i), comb.look ?? KIND_COLOURED));
        drawPeaks(ctx, peaks, toX, w, h);
      });
      scratches.length = combs.length;
      publishLabels();
    };
    // The label boxes as drawn, on the overlay canvas for tests and tools: written once the comb
    // rests (serialising them on every frame of a drag would cost the frame for nothing).
    let labelTimer = 0;
    const publishLabels = () => {
      clearTimeout(labelTimer);
      labelTimer = window.setTimeout(() => {
        if (!overlay) return;
        const boxes = scratches.map((s, comb) => drawnLabelBoxes(s).map((b) => ({ comb, ...b })));
        overlay.canvas.dataset.labelBoxes = JSON.stringify(boxes.flat());
        overlay.canvas.dataset.droppedLabels = String(scratches.reduce((n, s) => n + droppedLabels(s), 0));
      }, 150);
    };
    paintComb.current = repaint;

    // The one way the x window changes: reduce the arrays to it, then set data and scale in one commit.
    const show = (view: Window) => {
      const u = plot.current;
      if (!u || !(view[1] > view[0])) return;
      const { display } = live.current;
      const columns = columnsOf(u);
      const { win, yRange } = preparedWindow(display, view[0], view[1], columns);
      Object.assign(live.current, { view, win, yRange, columns });
      // The flux axis (unit and power of ten) is one per spectrum, so zooming never relabels it.
      if (live.current.flux.source !== display.source) {
        live.current.flux = fluxAxisOf(display);
        u.axes[1]!.label = live.current.flux.axis.label;
      }
      u.batch(() => {
        const sky = display.source.sky !== null && live.current.showSky;
        if (u.series[SKY]!.show !== sky) u.setSeries(SKY, { show: sky });
        if (u.series[MODEL]!.show !== (display.model !== null)) u.setSeries(MODEL, { show: display.model !== null });
        u.setData(toData(win), false);
        u.setScale('x', { min: view[0], max: view[1] });
      });
    };
    showWindow.current = show;

    // The flux range of the window being shown (uPlot asks before it commits the new x scale), found with its arrays.
    const yRange = (): uPlot.Range.MinMax => live.current.yRange ?? [-1, 1];

    const drawMasks = (u: uPlot) => {
      const runs = live.current.win?.masked;
      if (!runs) return;
      const { left, top, width, height } = u.bbox;
      u.ctx.save();
      u.ctx.fillStyle = PLOT.mask;
      for (let i = 0; i < runs.length; i += 2) {
        const x0 = Math.max(left, u.valToPos(runs[i]!, 'x', true));
        const x1 = Math.min(left + width, u.valToPos(runs[i + 1]!, 'x', true));
        if (x1 < left || x0 > left + width) continue;
        u.ctx.fillRect(x0, top, Math.max(2 * devicePixelRatio, x1 - x0), height);
      }
      u.ctx.restore();
    };

    // The ±1σ band under the series, one rectangle per screen column (band-columns.ts says why).
    const drawBand = (u: uPlot) => {
      const win = live.current.win;
      if (!win) return;
      const { left, width } = u.bbox;
      const columns = Math.ceil(width);
      if (bandTop.length < columns) (bandTop = new Float32Array(columns)), (bandBottom = new Float32Array(columns));
      const toX = (v: number) => u.valToPos(v, 'x', true) - left;
      const toY = (v: number) => u.valToPos(v, 'y', true);
      if (bandColumns(win.x, win.bandLow, win.bandHigh, toX, toY, columns, bandTop, bandBottom) === 0) return;
      const { top, height } = u.bbox;
      u.ctx.save();
      u.ctx.fillStyle = PLOT.errorBand;
      for (let c = 0; c < columns; c++) {
        const t = bandTop[c]!;
        if (Number.isNaN(t)) continue;
        const y0 = Math.max(top, t);
        const y1 = Math.min(top + height, bandBottom[c]!);
        if (y1 > y0 - 1) u.ctx.fillRect(left + c, y0, 1, Math.max(1, y1 - y0));
      }
      u.ctx.restore();
    };

    const xSplits = (u: uPlot, _axis: number, min: number, max: number, incr: number) => {
      if (!live.current.restFrame) {
        const out: number[] = [];
        for (let v = Math.ceil(min / incr) * incr; v <= max; v += incr) out.push(v);
        return out;
      }
      return restFrameSplits(min, max, trialZ(), Math.max(3, Math.floor(u.bbox.width / devicePixelRatio / 90)));
    };
    const xValues = (_u: uPlot, splits: number[]) => {
      if (splits.length === 0) return [];
      const k = live.current.restFrame ? 1 + trialZ() : 1;
      const step = splits.length > 1 ? (splits[1]! - splits[0]!) / k : 1;
      const d = decimalsFor(niceStep(step));
      return splits.map((v) => (v / k).toFixed(d));
    };

    // Ticks on round numbers of the axis as shown (uPlot's own steps stop short of 10⁻¹⁷-sized data).
    const ySplits = (u: uPlot, _axis: number, min: number, max: number) => fluxTicks(min, max, live.current.flux.axis.factor, Math.max(3, Math.floor(u.bbox.height / devicePixelRatio / 45))).splits;
    const yValues = (_u: uPlot, splits: number[]) => {
      if (splits.length === 0) return [];
      const { factor } = live.current.flux.axis;
      const step = splits.length > 1 ? Math.abs(splits[1]! - splits[0]!) * factor : 1;
      const d = decimalsFor(niceStep(step));
      return splits.map((v) => (Math.abs(v * factor) < step * 1e-6 ? '0' : (v * factor).toFixed(d)));
    };

    // Zoom by drag-select: uPlot reports the selection, the window is set here (with its arrays).
    const selected = (u: uPlot) => {
      const { left, width } = u.select;
      if (width <= 0) return;
      u.setSelect({ left: 0, top: 0, width: 0, height: 0 }, false);
      show([u.posToVal(left, 'x'), u.posToVal(left + width, 'x')]);
    };

    const { display } = live.current;
    live.current.flux = fluxAxisOf(display);
    const initial = fullRange(display);
    // Before uPlot has laid out its axes the plotting area's width is unknown; the element's width
    // is an upper bound (finer columns than needed, never coarser). A resize that widens the area
    // reduces the arrays again.
    const firstColumns = Math.max(1, Math.round((el.clientWidth || 800) * (window.devicePixelRatio || 1)));
    const { win: firstWin, yRange: firstY } = preparedWindow(display, initial[0], initial[1], firstColumns);
    Object.assign(live.current, { view: initial, win: firstWin, yRange: firstY, columns: firstColumns });

    const u = new uPlot(
      {
        width: el.clientWidth || 800,
        height: HEIGHT,
        legend: { show: false },
        scales: { x: { time: false, auto: false, range: () => live.current.view }, y: { range: yRange } },
        cursor: {
          drag: { x: true, y: false, setScale: false },
          points: { show: false },
          y: false,
          // A double click resets the zoom here (uPlot's own reset would take the window's arrays for the whole spectrum).
          bind: { dblclick: () => null },
        },
        series: [
          {},
          { label: 'sky', stroke: PLOT.sky, width: 1, points: { show: false }, show: display.source.sky !== null && live.current.showSky },
          { label: 'flux', stroke: PLOT.flux, width: 1, points: { show: false } },
          { label: 'model', stroke: PLOT.model, width: 1.5, points: { show: false }, show: display.model !== null },
        ],
        axes: [
          { label: axisLabel(false), stroke: PLOT.axis, grid: { stroke: PLOT.grid, width: 1 }, ticks: { stroke: PLOT.grid }, splits: xSplits, values: xValues },
          { label: live.current.flux.axis.label, stroke: PLOT.axis, grid: { stroke: PLOT.grid, width: 1 }, ticks: { stroke: PLOT.grid }, size: 64, splits: ySplits, values: yValues },
        ],
        hooks: {
          drawClear: [drawMasks],
          drawAxes: [drawBand],
          draw: [repaint],
          setSelect: [selected],
          setSize: [
            (u) => {
              overlay?.fit();
              repaint();
              // Reducing again inside uPlot's commit would change the data under it: wait for the commit to end.
              if (Math.round(u.bbox.width) > live.current.columns) queueMicrotask(() => show(live.current.view));
            },
          ],
        },
      },
      toData(firstWin),
      el,
    );
    plot.current = u;
    overlay = createOverlayCanvas(u);
    repaint();

    const detachPointer = attachPointer(u, live, show, repaint);
    const detachHover = attachLineHover(u, el, () => scratches);
    const resetOnDoubleClick = () => show(fullRange(live.current.display));
    u.over.addEventListener('dblclick', resetOnDoubleClick);
    const resize = new ResizeObserver(() => {
      const width = el.clientWidth;
      if (width > 0 && width !== u.width) u.setSize({ width, height: HEIGHT });
    });
    resize.observe(el);

    return () => {
      detachPointer();
      detachHover();
      clearTimeout(labelTimer);
      u.over.removeEventListener('dblclick', resetOnDoubleClick);
      resize.disconnect();
      u.destroy();
      plot.current = null;
    };
    // uPlot is built once per mount, also across spectra; later props reach it through `live` and the effects below.
  }, []);

  // The combs' stores speak once per frame; a new set of combs (a new spectrum) is drawn at once.
  useEffect(() => {
    paintComb.current();
    const unsubscribes = combs.map((c) => c.store.subscribe(() => paintComb.current()));
    return () => unsubscribes.forEach((off) => off());
  }, [combs]);

  // New spectrum: its whole range. New smoothing or model only: the same window.
  const shown = useRef(display);
  useEffect(() => {
    // The first display is the one uPlot was built with.
    if (!plot.current || shown.current === display) return;
    const sameSpectrum = shown.current.source === display.source;
    shown.current = display;
    live.current.display = display;
    showWindow.current(sameSpectrum ? live.current.view : fullRange(display));
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

  useEffect(() => {
    const u = plot.current;
    if (!u) return;
    const sky = live.current.display.source.sky !== null && showSky;
    if (u.series[SKY]!.show !== sky) u.setSeries(SKY, { show: sky });
  }, [showSky]);

  // The next spectrum's whole range, reduced ahead for this plot's width while the reader is on this one.
  useEffect(() => {
    if (upcoming === null) return;
    const prepare = () => {
      const u = plot.current;
      if (!u) return;
      // The width show() will reduce to.
      const columns = columnsOf(u);
      const next = upcoming();
      const [min, max] = fullRange(next);
      preparedWindow(next, min, max, columns);
    };
    const handle = whenIdle(prepare);
    return () => cancelIdle(handle);
  }, [upcoming]);

  return (
    <div
      ref={host}
      role="group"
      aria-label={label}
      aria-describedby={describedBy}
      tabIndex={0}
      className={`spectrum-plot relative isolate w-full select-none rounded-control ${tool === 'comb' ? 'cursor-ew-resize' : 'cursor-crosshair'}`}
    />
  );
}

/** The spectrum's whole wavelength range. */
const fullRange = (d: DisplayArrays): Window => {
  const w = d.source.wavelength;
  const lo = w[0] ?? 0;
  const hi = w[w.length - 1] ?? 1;
  return hi > lo ? [lo, hi] : [lo - 0.5, lo + 0.5];
};

/** The flux axis of a spectrum: its unit, scaled by the size of its flux (the larger end of its robust range). */
function fluxAxisOf(d: DisplayArrays): { source: DisplayArrays['source'] | null; axis: FluxAxis } {
  const { flux, mask, pixels, fluxUnit } = d.source;
  const range = robustRange(flux, mask, 0, pixels);
  const peak = range ? Math.max(Math.abs(range[0]), Math.abs(range[1])) : 0;
  return { source: d.source, axis: fluxAxis(fluxUnit, peak) };
}

/** Screen columns of the plotting area (device px): what a window is reduced to. */
const columnsOf = (u: uPlot) => Math.max(1, Math.round(u.bbox.width));

// Idle callbacks where the browser has them (not Safari), else a short timeout.
const whenIdle = (run: () => void): number => (typeof requestIdleCallback === 'function' ? requestIdleCallback(run, { timeout: 2000 }) : window.setTimeout(run, 200));
const cancelIdle = (handle: number) => (typeof cancelIdleCallback === 'function' ? cancelIdleCallback(handle) : window.clearTimeout(handle));

const axisLabel = (rest: boolean) => (rest ? 'Rest-frame wavelength at the trial z (Å, vacuum)' : 'Observed wavelength (Å, vacuum)');

const toData = (w: WindowArrays): uPlot.AlignedData => [w.x, w.sky, w.flux, w.model];

type Live = { current: { tool: PlotTool; combs: readonly PlotComb[]; peaks: Array<{ wavelength: number }>; onPeak: (index: number) => void; display: DisplayArrays; view: Window } };

/**
 * Pointer handling on the plotting area: with the comb tool a drag moves the comb (the marker
 * under the pointer follows it); Shift + drag pans with either tool; the wheel zooms around the
 * pointer. Cancelling pointerdown keeps uPlot's own drag-select out of comb drags and pans.
 * Pans and wheel zooms are applied once per frame, however many events arrive.
 */
function attachPointer(u: uPlot, live: Live, show: (view: Window) => void, repaint: () => void): () => void {
  const over = u.over;
  let mode: 'none' | 'comb' | 'pan' = 'none';
  let startX = 0;
  let startLambda = 0;
  let startZ = 0;
  let store: TrialZStore = live.current.combs[0]!.store;
  let startView: Window = [0, 1];
  let moved = false;
  let left = 0;
  let panFrame = 0;
  let panTo: Window = [0, 1];

  const localX = (e: PointerEvent | WheelEvent) => e.clientX - left;

  const down = (e: PointerEvent) => {
    if (e.button !== 0) return;
    const comb = live.current.tool === 'comb';
    if (!comb && !e.shiftKey) return;
    e.preventDefault();
    (over.closest('[role="group"]') as HTMLElement | null)?.focus({ preventScroll: true });
    over.setPointerCapture(e.pointerId);
    // Read the layout once per drag, not on every move (each read can force a layout).
    left = over.getBoundingClientRect().left;
    mode = e.shiftKey ? 'pan' : 'comb';
    startX = localX(e);
    startLambda = u.posToVal(startX, 'x');
    store = live.current.combs[0]!.store;
    startZ = store.get();
    startView = live.current.view;
    moved = false;
  };

  const move = (e: PointerEvent) => {
    if (mode === 'none') return;
    const x = localX(e);
    if (Math.abs(x - startX) > CLICK_SLOP_PX) moved = true;
    if (!moved) return;
    if (mode === 'comb') {
      store.set(dragZ(startZ, startLambda, u.posToVal(x, 'x')));
      return;
    }
    const perPx = (startView[1] - startView[0]) / over.clientWidth;
    const d = (startX - x) * perPx;
    panTo = [startView[0] + d, startView[1] + d];
    if (!panFrame) panFrame = requestAnimationFrame(() => ((panFrame = 0), show(panTo)));
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
    left = over.getBoundingClientRect().left;
    wheelAt = localX(e);
    if (wheelFrame) return;
    wheelFrame = requestAnimationFrame(() => {
      wheelFrame = 0;
      const [min, max] = live.current.view;
      const at = u.posToVal(wheelAt, 'x');
      const w = live.current.display.source.wavelength;
      const full = w[w.length - 1]! - w[0]!;
      const span = Math.min(full * 1.05, Math.max(full * 1e-4, (max - min) * wheelFactor));
      const frac = (at - min) / (max - min);
      wheelFactor = 1;
      show([at - frac * span, at + (1 - frac) * span]);
    });
  };

  over.addEventListener('pointerdown', down);
  over.addEventListener('pointermove', move);
  over.addEventListener('pointerup', up);
  over.addEventListener('pointercancel', up);
  over.addEventListener('wheel', wheel, { passive: false });
  return () => {
    cancelAnimationFrame(wheelFrame);
    cancelAnimationFrame(panFrame);
    over.removeEventListener('pointerdown', down);
    over.removeEventListener('pointermove', move);
    over.removeEventListener('pointerup', up);
    over.removeEventListener('pointercancel', up);
    over.removeEventListener('wheel', wheel);
  };
}

/** How close (CSS px) the pointer must be to a marker to list it. */
const HOVER_SLOP_PX = 4;

/**
 * The full list of comb lines under the pointer, in a tooltip: every marker within a few px (or
 * whose label is pointed at), with its observed wavelength, saying which labels were dropped for
 * lack of room. It follows the pointer once per frame and stays away while a button is held.
 */
function attachLineHover(u: uPlot, host: HTMLElement, scratches: () => readonly CombScratch[]): () => void {
  const tip = document.createElement('div');
  tip.setAttribute('role', 'tooltip');
  tip.id = `comb-lines-${Math.random().toString(36).slice(2, 8)}`;
  tip.className = 'comb-lines-tip pointer-events-none absolute z-10 hidden max-w-72 rounded-control border border-paper-300 bg-paper-50 px-2 py-1 text-xs text-ink-800 shadow';
  host.appendChild(tip);
  let frame = 0;
  let at: { x: number; y: number } | null = null;
  const render = () => {
    frame = 0;
    const found: Array<DrawnMarker & { comb: number }> = [];
    if (at) scratches().forEach((s, comb) => markersAt(s, at!.x, at!.y, HOVER_SLOP_PX).forEach((m) => found.push({ ...m, comb })));
    if (!at || found.length === 0) {
      tip.classList.add('hidden');
      tip.replaceChildren();
      u.over.removeAttribute('aria-describedby');
      return;
    }
    const hidden = found.filter((m) => !m.labelled).length;
    tip.replaceChildren(
      ...found.map((m) => {
        const row = document.createElement('div');
        row.className = 'num whitespace-nowrap';
        const lambda = u.posToVal(m.x, 'x');
        row.textContent = `${m.line.name} · ${m.line.rest.toFixed(1)} Å rest · ${lambda.toFixed(1)} Å${scratches().length > 1 ? ` · comb ${m.comb + 1}` : ''}${m.labelled ? '' : ' (label hidden)'}`;
        const offset = (m.line as { offsetKms?: number }).offsetKms;
        if (offset !== undefined) row.textContent += ` · template peak ${offset > 0 ? '+' : '−'}${Math.abs(offset)} km/s (short tick)`;
        return row;
      }),
    );
    if (hidden > 0) {
      const note = document.createElement('div');
      note.className = 'text-ink-500';
      note.textContent = `${hidden} label${hidden === 1 ? '' : 's'} hidden here for lack of room`;
      tip.appendChild(note);
    }
    const hostBox = host.getBoundingClientRect();
    const overBox = u.over.getBoundingClientRect();
    const overLeft = overBox.left - hostBox.left;
    const overTop = overBox.top - hostBox.top;
    tip.classList.remove('hidden');
    const flip = at.x > u.over.clientWidth / 2;
    tip.style.left = flip ? '' : `${overLeft + at.x + 12}px`;
    tip.style.right = flip ? `${host.clientWidth - overLeft - at.x + 12}px` : '';
    tip.style.top = `${overTop + Math.max(0, at.y - 8)}px`;
    u.over.setAttribute('aria-describedby', tip.id);
  };
  const move = (e: PointerEvent) => {
    if (e.buttons !== 0) {
      at = null;
    } else {
      const r = u.over.getBoundingClientRect();
      at = { x: e.clientX - r.left, y: e.clientY - r.top };
    }
    if (!frame) frame = requestAnimationFrame(render);
  };
  const leave = () => {
    at = null;
    if (!frame) frame = requestAnimationFrame(render);
  };
  u.over.addEventListener('pointermove', move);
  u.over.addEventListener('pointerleave', leave);
  return () => {
    cancelAnimationFrame(frame);
    u.over.removeEventListener('pointermove', move);
    u.over.removeEventListener('pointerleave', leave);
    tip.remove();
  };
}
