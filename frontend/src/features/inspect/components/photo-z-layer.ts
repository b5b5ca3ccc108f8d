import { useCallback, useRef } from 'react';
import type uPlot from 'uplot';
import { createOverlayCanvas, type OverlayCanvas } from '@/components/spectrum/overlay-canvas';
import type { PhotoZPosterior } from '../api/get-photo-z-posterior';

/** P(z) fill and outline on the χ² strip (the ember of the photometry panel, see-through so curves stay readable). */
const FILL = 'rgba(224, 120, 75, 0.22)';
const LINE = 'rgba(147, 55, 20, 0.85)';
/** The density's peak reaches this fraction of the strip's height. */
const PEAK_SHARE = 0.6;

/**
 * A draw callback for the χ² strip that paints the target's photometric P(z) on a canvas of its
 * own over the plotting area, against the strip's z axis (scaled to its peak: only its shape and
 * where it sits matter there), with the 95 % interval as a bar along the bottom. Without a
 * posterior it clears its canvas.
 */
export function usePhotoZLayer(posterior: PhotoZPosterior | null | undefined, z95: [number, number] | null) {
  const layers = useRef(new WeakMap<uPlot, OverlayCanvas>());
  return useCallback(
    (u: uPlot) => {
      let layer = layers.current.get(u);
      if (!layer) {
        layer = createOverlayCanvas(u);
        layer.canvas.dataset.layer = 'photo-z-posterior';
        layers.current.set(u, layer);
      } else if (layer.canvas.width !== Math.round(u.over.clientWidth * (window.devicePixelRatio || 1))) {
        layer.fit();
      }
      layer.canvas.dataset.drawn = posterior ? 'true' : 'false';
      layer.paint((ctx, w, h) => {
        if (!posterior || posterior.z.length === 0) return;
        let peak = 0;
        for (const p of posterior.p) if (p > peak) peak = p;
        if (!(peak > 0)) return;
        const y = (p: number) => h - (h * PEAK_SHARE * p) / peak;
        ctx.beginPath();
        ctx.moveTo(u.valToPos(posterior.z[0]!, 'x'), h);
        for (let i = 0; i < posterior.z.length; i++) ctx.lineTo(u.valToPos(posterior.z[i]!, 'x'), y(posterior.p[i]!));
        ctx.lineTo(u.valToPos(posterior.z[posterior.z.length - 1]!, 'x'), h);
        ctx.closePath();
        ctx.fillStyle = FILL;
        ctx.fill();
        ctx.strokeStyle = LINE;
        ctx.lineWidth = 1;
        ctx.stroke();
        if (z95) {
          const x0 = u.valToPos(z95[0], 'x');
          const x1 = u.valToPos(z95[1], 'x');
          ctx.fillStyle = LINE;
          ctx.fillRect(x0, h - 3, Math.max(1, x1 - x0), 3);
        }
      });
    },
    [posterior, z95],
  );
}
