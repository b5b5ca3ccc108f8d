import { useEffect, useMemo, useRef, useState } from 'react';
import { SelectField } from '@/components/ui/field';
import type { DisplayArrays } from '@/components/spectrum/use-display-arrays';
import { useTrialZDerived } from '../hooks/use-trial-z';
import { FEATURE_WINDOWS, windowSpan } from '../utils/feature-windows';
import type { FeatureWindow } from '../utils/feature-windows';
import { createViewGate } from '../utils/view-gate';
import type { ViewGate } from '../utils/view-gate';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';
import { drawFeature, FEATURE_H, FEATURE_W } from './draw-feature';

const HALF_WIDTHS = [1000, 3000, 6000] as const;

/**
 * Close-ups in velocity around the deciding features at the trial z, for features the data cover.
 * During a drag the list re-renders only when a feature enters or leaves the data; the canvases
 * repaint themselves once per frame from the trial-z store, with the feature's observed
 * wavelength drawn in them (text in the page would cost a layout on every frame). While a
 * close-up is scrolled out of view (or hidden) it neither follows a drag nor draws a new spectrum;
 * it catches up when it comes back (a move to the next spectrum then does not pay for close-ups
 * nobody sees).
 */
export function FeaturePanels({ display, store }: { display: DisplayArrays; store: TrialZStore }) {
  const [halfWidth, setHalfWidth] = useState<number>(3000);
  const w = display.source.wavelength;
  const lo = w[0] ?? 0;
  const hi = w[w.length - 1] ?? 0;
  const ids = useTrialZDerived(store, (z) =>
    FEATURE_WINDOWS.filter((f) => {
      const [a, b] = windowSpan(f, z, halfWidth);
      return b > lo && a < hi;
    })
      .map((f) => f.id)
      .join(' '),
  );
  const inData = new Set(ids.split(' '));
  const list = useRef<HTMLUListElement>(null);
  const gate = useMemo(createViewGate, []);
  useEffect(() => {
    const seen = new IntersectionObserver((entries) => gate.set(entries.at(-1)?.isIntersecting ?? true));
    seen.observe(list.current!);
    return () => seen.disconnect();
  }, [gate]);

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
      {inData.has('') ? <p className="text-ink-500">None of the close-up features falls inside the data at this redshift.</p> : null}
      {/* Every close-up stays mounted and is hidden while its feature is outside the data: a canvas
          made or dropped costs more than the paint (software compositing), on every new spectrum. */}
      <ul ref={list} className="flex flex-wrap gap-3">
        {FEATURE_WINDOWS.map((f) => (
          <li key={f.id} hidden={!inData.has(f.id)}>
            <FeatureCanvas feature={f} shown={inData.has(f.id)} store={store} halfWidth={halfWidth} display={display} list={gate} />
          </li>
        ))}
      </ul>
    </section>
  );
}

/**
 * One close-up. Its canvas is a compositing layer of its own (will-change), so its repaint on
 * every frame of a drag reaches the compositor as new canvas content without repainting the
 * panel around it. (In-page A/B runs on the 2-core VM, software raster, could not tell the
 * difference from no layer within their noise: about ±1.5 ms per frame.)
 */
function FeatureCanvas({ feature, shown, store, halfWidth, display, list }: { feature: FeatureWindow; shown: boolean; store: TrialZStore; halfWidth: number; display: DisplayArrays; list: ViewGate }) {
  const ref = useRef<HTMLCanvasElement>(null);
  // This close-up's own visibility (hidden, or scrolled away), kept from one spectrum to the next.
  const [gate] = useState(() => createViewGate(false));
  const wasShown = useRef(false);
  useEffect(() => {
    const seen = new IntersectionObserver((entries) => gate.set(entries.at(-1)?.isIntersecting ?? true));
    seen.observe(ref.current!);
    return () => seen.disconnect();
  }, [gate]);
  useEffect(() => {
    if (!shown) {
      wasShown.current = false;
      return;
    }
    const canvas = ref.current!;
    const ratio = window.devicePixelRatio || 1;
    // Setting a canvas's size, even to the same value, throws its bitmap away: only when it changes.
    if (canvas.width !== FEATURE_W * ratio) canvas.width = FEATURE_W * ratio;
    if (canvas.height !== FEATURE_H * ratio) canvas.height = FEATURE_H * ratio;
    const ctx = canvas.getContext('2d')!;
    ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
    const paint = () => drawFeature(ctx, feature, store.get(), halfWidth, display);
    // A close-up that has just appeared takes the list's visibility until its own observer reports
    // (a frame later): in a list on screen it paints at once, as a new element would.
    if (!wasShown.current) {
      wasShown.current = true;
      gate.forget(canvas);
      gate.set(list.visible);
    }
    gate.paintOrDefer(canvas, paint);
    const unsubscribe = store.subscribe(() => gate.paintOrDefer(canvas, paint));
    return () => {
      gate.forget(canvas);
      unsubscribe();
    };
  }, [feature, shown, store, halfWidth, display, gate, list]);
  const marks = feature.marks.map((m) => m.label).join(', ');
  return (
    <figure className="rounded-control border border-paper-300 bg-paper-50 p-1.5">
      <figcaption className="mb-1 text-xs font-medium text-ink-700">{feature.title}</figcaption>
      <canvas
        ref={ref}
        role="img"
        aria-label={`${feature.title} from −${halfWidth} to +${halfWidth} km/s around its expected position at the trial redshift; marks at ${marks}`}
        style={{ width: FEATURE_W, height: FEATURE_H, willChange: 'transform' }}
      />
    </figure>
  );
}
