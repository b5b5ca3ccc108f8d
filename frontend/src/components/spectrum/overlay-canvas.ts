import type uPlot from 'uplot';

/**
 * A transparent canvas laid over uPlot's plotting area. Overlays (the comb, the strip's cursor)
 * redraw here alone, so moving them never re-renders the series underneath.
 */
export interface OverlayCanvas {
  canvas: HTMLCanvasElement;
  /** Clears and hands a context in CSS px; the callback draws. */
  paint: (draw: (ctx: CanvasRenderingContext2D, width: number, height: number) => void) => void;
  /** Matches the canvas to the plotting area after uPlot resizes. */
  fit: () => void;
}

export function createOverlayCanvas(u: uPlot): OverlayCanvas {
  const canvas = document.createElement('canvas');
  canvas.setAttribute('aria-hidden', 'true');
  // A layer of its own: a repaint of the overlay then reaches the compositor as new canvas content,
  // without repainting and re-rasterising the plot it sits on.
  canvas.style.cssText = 'position:absolute;left:0;top:0;pointer-events:none;will-change:transform;';
  u.over.appendChild(canvas);
  const ctx = canvas.getContext('2d')!;
  let width = 0;
  let height = 0;
  let ratio = 1;
  const fit = () => {
    ratio = window.devicePixelRatio || 1;
    width = u.over.clientWidth;
    height = u.over.clientHeight;
    canvas.width = Math.round(width * ratio);
    canvas.height = Math.round(height * ratio);
    canvas.style.width = `${width}px`;
    canvas.style.height = `${height}px`;
  };
  fit();
  return {
    canvas,
    fit,
    paint: (draw) => {
      ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
      ctx.clearRect(0, 0, width, height);
      draw(ctx, width, height);
    },
  };
}
