import type { RefObject } from 'react';
import { Button } from '@/components/ui/button';
import { controlClass } from '@/components/ui/field';
import type { Smoothing, SmoothingKind } from '@/components/spectrum/smooth';
import type { PlotControls, PlotTool } from '@/components/spectrum/spectrum-plot';

interface Props {
  tool: PlotTool;
  onTool: (tool: PlotTool) => void;
  smoothing: Smoothing;
  onSmoothing: (s: Smoothing) => void;
  restFrame: boolean;
  onRestFrame: (rest: boolean) => void;
  controls: RefObject<PlotControls | null>;
}

const TOOLS: Array<{ id: PlotTool; label: string; hint: string }> = [
  { id: 'comb', label: 'Comb', hint: 'drag moves the comb' },
  { id: 'zoom', label: 'Zoom', hint: 'drag selects a range' },
];

/** Everything the pointer does on the plot, as ordinary controls (and keys, see the key map). */
export function PlotToolbar({ tool, onTool, smoothing, onSmoothing, restFrame, onRestFrame, controls }: Props) {
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
      <div className="flex items-end gap-2">
        <div className="flex flex-col gap-1">
          <label htmlFor="smoothing-kind" className="text-sm font-medium text-ink-800">
            Smoothing
          </label>
          <select
            id="smoothing-kind"
            value={smoothing.kind}
            onChange={(e) => onSmoothing({ ...smoothing, kind: e.target.value as SmoothingKind })}
            className={`${controlClass} w-28 py-1 text-sm`}
          >
            <option value="none">none</option>
            <option value="boxcar">boxcar</option>
            <option value="gaussian">Gaussian</option>
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="smoothing-width" className="text-sm font-medium text-ink-800">
            Width (pixels)
          </label>
          <input
            id="smoothing-width"
            type="number"
            min={2}
            max={101}
            step={1}
            value={smoothing.width}
            disabled={smoothing.kind === 'none'}
            onChange={(e) => {
              const w = Math.round(Number(e.target.value));
              if (w >= 2 && w <= 101) onSmoothing({ ...smoothing, width: w });
            }}
            className={`${controlClass} num w-20 py-1 text-sm`}
          />
        </div>
      </div>
      <label className="flex items-center gap-2 pb-1 text-sm text-ink-800">
        <input type="checkbox" checked={restFrame} onChange={(e) => onRestFrame(e.target.checked)} className="size-4 accent-ink-900" />
        Rest-frame axis
      </label>
    </div>
  );
}
