type Listener = (z: number) => void;

/** Runs a callback before the next frame is drawn; returns a handle for `cancel`. */
export interface FrameScheduler {
  request: (callback: () => void) => number;
  cancel: (handle: number) => void;
}

const animationFrames: FrameScheduler = {
  request: (callback) => requestAnimationFrame(callback),
  cancel: (handle) => cancelAnimationFrame(handle),
};

/**
 * The comb's trial redshift lives outside React: a drag changes it on every pointer move, and
 * only the few things that show it (the comb overlay, the strip cursor, the input) should hear
 * about it, not the whole screen. `get` is always current; listeners hear at most once per
 * animation frame, all in one callback, with the latest value — so a burst of moves costs one
 * repaint, and React renders triggered there land in the same frame as the overlays. Values are
 * clamped to the campaign's range.
 */
export interface TrialZStore {
  get: () => number;
  set: (z: number) => void;
  subscribe: (listener: Listener) => () => void;
  readonly min: number;
  readonly max: number;
}

export function createTrialZStore(initial: number, min: number, max: number, frames: FrameScheduler = animationFrames): TrialZStore {
  let z = clamp(initial, min, max);
  const listeners = new Set<Listener>();
  let pending = 0;
  const flush = () => {
    pending = 0;
    for (const l of listeners) l(z);
  };
  return {
    min,
    max,
    get: () => z,
    set: (next) => {
      const v = clamp(next, min, max);
      if (v === z || !Number.isFinite(v)) return;
      z = v;
      if (listeners.size > 0 && pending === 0) pending = frames.request(flush);
    },
    subscribe: (l) => {
      listeners.add(l);
      return () => {
        listeners.delete(l);
        if (listeners.size === 0 && pending !== 0) {
          frames.cancel(pending);
          pending = 0;
        }
      };
    },
  };
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
