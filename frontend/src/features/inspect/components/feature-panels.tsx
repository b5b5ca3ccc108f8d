import { useEffect, useRef, useState } from 'react';
import { SelectField } from '@/components/ui/field';
import type { DisplayArrays } from '@/components/spectrum/use-display-arrays';
import { useTrialZPerFrame } from '../hooks/use-trial-z';
import { FEATURE_WINDOWS, velocityOf, windowSpan } from '../utils/feature-windows';
import type { FeatureWindow } from '../utils/feature-windows';
import { PLOT } from '@/components/spectrum/plot-palette';
import { lowerBound, robustRange } from '@/components/spectrum/robust-range';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';

const HALF_WIDTHS = [1000, 3000, 6000] as const;
const W = 220;
const H = 120;

/** Close-ups in velocity around the deciding features at the trial z, for features the data cover. */
export function FeaturePanels({ display, store }: { display: DisplayArrays; store: TrialZStore }) {
  const z = useTrialZPerFrame(store);
  const [halfWidth, setHalfWidth] = useState<number>(3000);
  const w = display.source.wavelength;
  const lo = w[0] ?? 0;
  const hi = w[w.length - 1] ?? 0;
  const visible = FEATURE_WINDOWS.filter((f) => {
    const [a, b] = windowSpan(f, z, halfWidth);
    return b > lo && a < hi;
  });

  return (
    <section aria-labelledby="feature-panels-title" className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="feature-panels-title" className="text-md font-semibold text-ink-900">
          Features at the trial z
        </h2>
        <SelectField label="Half-width" value={halfWidth} onChange={(e) => setHalfWidth(Number(e.target.value))} fieldClassName="w-36" className="num">
          {HALF_WIDTHS.map((v) => (
            <option key={v} value={v}>
              ± {v.toLocaleString('en')} km/s
            </option>
          ))}
        </SelectField>
      </div>
      {visible.length === 0 ? (
        <p className="text-ink-500">None of the close-up features falls inside the data at this redshift.</p>
      ) : (
        <ul className="flex flex-wrap gap-3">
          {visible.map((f) => (
            <li key={f.id}>
              <FeatureCanvas feature={f} z={z} halfWidth={halfWidth} display={display} />
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function FeatureCanvas({ feature, z, halfWidth, display }: { feature: FeatureWindow; z: number; halfWidth: number; display: DisplayArrays }) {
  const ref = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    const canvas = ref.current!;
    const ratio = window.devicePixelRatio || 1;
    canvas.width = W * ratio;
    canvas.height = H * ratio;
    const ctx = canvas.getContext('2d')!;
    ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
    drawFeature(ctx, feature, z, halfWidth, display);
  }, [feature, z, halfWidth, display]);
  const marks = feature.marks.map((m) => m.label).join(', ');
  return (
    <figure className="rounded-control border border-paper-300 bg-paper-50 p-1.5">
      <figcaption className="mb-1 flex justify-between text-xs text-ink-700">
        <span className="font-medium">{feature.title}</span>
        <span className="num text-ink-500">{(feature.anchor * (1 + z)).toFixed(1)} Å</span>
      </figcaption>
      <canvas
        ref={ref}
        role="img"
        aria-label={`${feature.title} from −${halfWidth} to +${halfWidth} km/s around its expected position at z = ${z.toFixed(5)}; marks at ${marks}`}
        style={{ width: W, height: H }}
      />
    </figure>
  );
}

/** Draws flux (as shown above, smoothed or not), its band and the expected positions; x in km/s. */
function drawFeature(ctx: CanvasRenderingContext2D, f: FeatureWindow, z: number, halfWidth: number, d: DisplayArrays) {
  ctx.clearRect(0, 0, W, H);
  const [a, b] = windowSpan(f, z, halfWidth);
  const w = d.source.wavelength;
  const i0 = Math.max(0, lowerBound(w, a) - 1);
  const i1 = Math.min(w.length, lowerBound(w, b) + 1);
  const vMin = velocityOf(a, f.anchor, z);
  const vMax = velocityOf(b, f.anchor, z);
  const range = robustRange(d.flux, d.source.mask, i0, i1, 0, 1) ?? [-1, 1];
  const pad = { l: 4, r: 4, t: 4, b: 14 };
  const toX = (lambda: number) => pad.l + ((velocityOf(lambda, f.anchor, z) - vMin) / (vMax - vMin)) * (W - pad.l - pad.r);
  const toY = (v: number) => pad.t + (1 - (v - range[0]) / (range[1] - range[0])) * (H - pad.t - pad.b);

  ctx.fillStyle = PLOT.mask;
  for (let i = i0; i < i1; i++) if (d.source.mask[i]) ctx.fillRect(toX(w[i]!) - 1, pad.t, 2, H - pad.t - pad.b);

  ctx.fillStyle = PLOT.errorBand;
  ctx.beginPath();
  for (let i = i0; i < i1; i++) ctx.lineTo(toX(w[i]!), toY(d.bandHigh[i]!));
  for (let i = i1 - 1; i >= i0; i--) ctx.lineTo(toX(w[i]!), toY(d.bandLow[i]!));
  ctx.fill();

  ctx.strokeStyle = PLOT.flux;
  ctx.lineWidth = 1;
  ctx.beginPath();
  let pen = false;
  for (let i = i0; i < i1; i++) {
    const v = d.flux[i]!;
    if (!Number.isFinite(v)) {
      pen = false;
      continue;
    }
    // Steps, not a line: at these scales a reader counts pixels across a doublet.
    const x0 = i > 0 ? toX((w[i]! + w[i - 1]!) / 2) : toX(w[i]!);
    const x1 = i < w.length - 1 ? toX((w[i]! + w[i + 1]!) / 2) : toX(w[i]!);
    if (pen) ctx.lineTo(x0, toY(v));
    else ctx.moveTo(x0, toY(v));
    ctx.lineTo(x1, toY(v));
    pen = true;
  }
  ctx.stroke();

  ctx.font = '9px "IBM Plex Mono", ui-monospace, monospace';
  ctx.strokeStyle = PLOT.emission;
  ctx.fillStyle = PLOT.emission;
  ctx.setLineDash([3, 2]);
  for (const m of f.marks) {
    const x = Math.round(toX(m.rest * (1 + z))) + 0.5;
    ctx.beginPath();
    ctx.moveTo(x, pad.t);
    ctx.lineTo(x, H - pad.b);
    ctx.stroke();
  }
  ctx.setLineDash([]);
  ctx.fillStyle = PLOT.axis;
  ctx.textBaseline = 'top';
  ctx.fillText(`${Math.round(vMin)}`, pad.l, H - 11);
  const right = `+${Math.round(vMax)} km/s`;
  ctx.fillText(right, W - pad.r - ctx.measureText(right).width, H - 11);
}
