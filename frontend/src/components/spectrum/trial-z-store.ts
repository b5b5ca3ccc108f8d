type Listener = (z: number) => void;

/**
 * The comb's trial redshift lives outside React: a drag changes it on every pointer move, and
 * only the few things that show it (the comb overlay, the strip cursor, the input) should hear
 * about it, not the whole screen. Values are clamped to the campaign's range.
 */
export interface TrialZStore {
  get: () => number;
  set: (z: number) => void;
  subscribe: (listener: Listener) => () => void;
  readonly min: number;
  readonly max: number;
}

export function createTrialZStore(initial: number, min: number, max: number): TrialZStore {
  let z = clamp(initial, min, max);
  const listeners = new Set<Listener>();
  return {
    min,
    max,
    get: () => z,
    set: (next) => {
      const v = clamp(next, min, max);
      if (v === z || !Number.isFinite(v)) return;
      z = v;
      for (const l of listeners) l(z);
    },
    subscribe: (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
  };
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
