import { useMemo, useState } from 'react';
import type { RefObject } from 'react';
import { Button } from '@/components/ui/button';
import { controlClass } from '@/components/ui/field';
import { convertSmoothingWidth, MAX_SMOOTHING_PIXELS } from '@/components/spectrum/smooth';
import type { Smoothing, SmoothingKind, SmoothingUnit } from '@/components/spectrum/smooth';
import { pixelVelocitySummary } from '@/components/spectrum/velocity';
import type { PlotControls, PlotTool } from '@/components/spectrum/spectrum-plot';
import { isCombClass } from '@/components/spectrum/comb-lines';
import { SMOOTH_BELOW_SNR } from '@/components/spectrum/default-smoothing';
import { CLASS_NAMES } from '@/lib/spectrum-class';

interface Props {
  tool: PlotTool;
  onTool: (tool: PlotTool) => void;
  smoothing: Smoothing;
  onSmoothing: (s: Smoothing) => void;
  /** The S/N-matched default: the median S/N per pixel it follows, whether it is in force, and the way back to it. */
  smoothingDefault: { snr: number | null; active: boolean; onRestore: () => void };
  /** Which lines the comb draws: the class's (cls) or all of them. */
  lineSet: { cls: string; all: boolean; onAll: (all: boolean) => void };
  /** The sky spectrum's switch, when the file has a sky. */
  sky: { shown: boolean; swamps: boolean; onShown: (shown: boolean) => void } | null;
  /** The spectrum's grid (vacuum Å): a width in km/s is converted with its pixels' velocity widths. */
  wavelength: Float64Array;
  restFrame: boolean;
  onRestFrame: (rest: boolean) => void;
  controls: RefObject<PlotControls | null>;
}

const TOOLS: Array<{ id: PlotTool; label: string; hint: string }> = [
  { id: 'comb', label: 'Comb', hint: 'drag moves the comb' },
  { id: 'zoom', label: 'Zoom', hint: 'drag selects a range' },
];

/** Everything the pointer does on the plot, as ordinary controls (and keys, see the key map). */
export function PlotToolbar({ tool, onTool, smoothing, onSmoothing, smoothingDefault, lineSet, sky, wavelength, restFrame, onRestFrame, controls }: Props) {
  const narrowed = isCombClass(lineSet.cls);
  return (
    <div className="flex flex-wrap items-end gap-x-4 gap-y-2">
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 text-sm font-medium text-ink-800">Drag tool</legend>
        <div className="flex overflow-hidden rounded-control border border-paper-300">
          {TOOLS.map((t) => (
            <label key={t.id} title={t.hint} className={`cursor-pointer px-2.5 py-1 text-sm has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-blueend-500 ${tool === t.id ? 'bg-ink-900 text-paper-50' : 'bg-paper-50 text-ink-800 hover:bg-paper-200'}`}>
              <input type="radio" name="plot-tool" value={t.id} checked={tool === t.id} onChange={() => onTool(t.id)} className="sr-only" />
              {t.label}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex items-end gap-1.5">
        <Button variant="secondary" size="sm" onClick={() => controls.current?.zoomBy(0.5)}>
          Zoom in
        </Button>
        <Button variant="secondary" size="sm" onClick={() => controls.current?.zoomBy(2)}>
          Zoom out
        </Button>
        <Button variant="secondary" size="sm" onClick={() => controls.current?.panBy(-0.25)} aria-label="Pan left">
          ◀
        </Button>
        <Button variant="secondary" size="sm" onClick={() => controls.current?.panBy(0.25)} aria-label="Pan right">
          ▶
        </Button>
        <Button variant="secondary" size="sm" onClick={() => controls.current?.resetZoom()}>
          Reset zoom
        </Button>
      </div>
      <SmoothingControls smoothing={smoothing} onSmoothing={onSmoothing} wavelength={wavelength} />
      <SmoothingDefaultNote {...smoothingDefault} />
      <label className="flex items-center gap-2 pb-1 text-sm text-ink-800">
        <input type="checkbox" checked={restFrame} onChange={(e) => onRestFrame(e.target.checked)} className="size-4 accent-ink-900" />
        Rest-frame axis
      </label>
      <label className="flex items-center gap-2 pb-1 text-sm text-ink-800" title={narrowed ? `The comb draws the lines of ${CLASS_NAMES[lineSet.cls as keyof typeof CLASS_NAMES]} templates; tick to draw every line` : 'The class is unknown: the comb draws every line'}>
        <input type="checkbox" checked={lineSet.all || !narrowed} disabled={!narrowed} onChange={(e) => lineSet.onAll(e.target.checked)} className="size-4 accent-ink-900" />
        All lines{narrowed && !lineSet.all ? <span className="text-xs text-ink-500">(now: {CLASS_NAMES[lineSet.cls as keyof typeof CLASS_NAMES]} lines)</span> : null}
      </label>
      {sky ? (
        <label className="flex items-center gap-2 pb-1 text-sm text-ink-800">
          <input type="checkbox" checked={sky.shown} onChange={(e) => sky.onShown(e.target.checked)} className="size-4 accent-ink-900" />
          Sky{sky.swamps ? <span className="text-xs text-ink-500">(swamps the data: hidden at first)</span> : null}
        </label>
      ) : null}
    </div>
  );
}

/**
 * Kind, width and unit of the smoothing. A width in km/s is converted with each pixel's own
 * velocity width; switching unit carries the width over at the spectrum's median pixel. The
 * widest smoothing is MAX_SMOOTHING_PIXELS pixels, in km/s that many of the narrowest pixel.
 */
function SmoothingControls({ smoothing, onSmoothing, wavelength }: { smoothing: Smoothing; onSmoothing: (s: Smoothing) => void; wavelength: Float64Array }) {
  const off = smoothing.kind === 'none';
  // Only needed while smoothing is on: a pass over every pixel, not made on each new spectrum otherwise.
  const grid = useMemo(() => {
    if (off || wavelength.length < 2) return null;
    const v = pixelVelocitySummary(wavelength);
    return { kmsPerPixel: v.median, maxKms: Math.floor(MAX_SMOOTHING_PIXELS * v.min) };
  }, [wavelength, off]);
  const [typed, setTyped] = useState<string | null>(null);
  const kms = smoothing.unit === 'km/s';
  const min = kms ? 1 : 2;
  const max = kms ? Math.max(1, grid?.maxKms ?? smoothing.width) : MAX_SMOOTHING_PIXELS;
  const apply = (text: string) => {
    setTyped(text);
    const w = Math.round(Number(text));
    if (text.trim() !== '' && w >= min && w <= max) onSmoothing({ ...smoothing, width: w });
  };
  const changeUnit = (unit: SmoothingUnit) => {
    if (!grid || unit === smoothing.unit) return;
    const carried = Math.round(convertSmoothingWidth(smoothing.width, smoothing.unit, unit, grid.kmsPerPixel));
    const [lo, hi] = unit === 'km/s' ? [1, Math.max(1, grid.maxKms)] : [2, MAX_SMOOTHING_PIXELS];
    setTyped(null);
    onSmoothing({ ...smoothing, unit, width: Math.min(hi, Math.max(lo, carried)) });
  };
  return (
    <div className="flex items-end gap-2">
      <div className="flex flex-col gap-1">
        <label htmlFor="smoothing-kind" className="text-sm font-medium text-ink-800">
          Smoothing
        </label>
        <select id="smoothing-kind" value={smoothing.kind} onChange={(e) => onSmoothing({ ...smoothing, kind: e.target.value as SmoothingKind })} className={`${controlClass} w-28 py-1 text-sm`}>
          <option value="none">none</option>
          <option value="boxcar">boxcar</option>
          <option value="gaussian">Gaussian</option>
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="smoothing-width" className="text-sm font-medium text-ink-800">
          Width
        </label>
        <input
          id="smoothing-width"
          type="number"
          min={min}
          max={max}
          step={1}
          value={typed ?? String(smoothing.width)}
          disabled={off}
          aria-describedby="smoothing-width-hint"
          onChange={(e) => apply(e.target.value)}
          onBlur={() => setTyped(null)}
          className={`${controlClass} num w-20 py-1 text-sm`}
        />
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="smoothing-unit" className="text-sm font-medium text-ink-800">
          Unit
        </label>
        <select id="smoothing-unit" value={smoothing.unit} disabled={off || !grid} onChange={(e) => changeUnit(e.target.value as SmoothingUnit)} className={`${controlClass} w-24 py-1 text-sm`}>
          <option value="pixels">pixels</option>
          <option value="km/s">km/s</option>
        </select>
      </div>
      {grid && !off ? (
        <span aria-hidden="true" className="num pb-1.5 text-xs text-ink-500">
          ≈ {kms ? `${(smoothing.width / grid.kmsPerPixel).toFixed(1)} px` : `${Math.round(smoothing.width * grid.kmsPerPixel)} km/s`}
        </span>
      ) : null}
      <p id="smoothing-width-hint" className="sr-only">
        {smoothing.kind === 'gaussian' ? 'Full width at half maximum' : 'Full width'}, from {min} to {max} {smoothing.unit}
        {grid ? `; one pixel is about ${Math.round(grid.kmsPerPixel)} km/s at the middle of this spectrum` : ''}.
      </p>
    </div>
  );
}

/** Says where the opening smoothing came from, and offers it back once the reader has changed it. */
function SmoothingDefaultNote({ snr, active, onRestore }: { snr: number | null; active: boolean; onRestore: () => void }) {
  const low = snr !== null && snr < SMOOTH_BELOW_SNR;
  if (active) {
    return (
      <span className="num pb-1.5 text-xs text-ink-500">
        {snr === null ? 'no errors: no S/N default' : `median S/N ${snr.toFixed(1)} per pixel${low ? ` (< ${SMOOTH_BELOW_SNR}): smoothed to match` : ''}`}
      </span>
    );
  }
  return (
    <Button variant="secondary" size="sm" onClick={onRestore} title={`Smoothing matched to the S/N: a boxcar of (${SMOOTH_BELOW_SNR} / S/N)² pixels (3 to 9) below S/N ${SMOOTH_BELOW_SNR} per pixel, none above`}>
      S/N default
    </Button>
  );
}
