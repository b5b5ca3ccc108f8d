import { useEffect, useState, useSyncExternalStore } from 'react';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';

/** The trial z on every change: for small things (the input) that must follow a drag exactly. */
export const useTrialZ = (store: TrialZStore) => useSyncExternalStore(store.subscribe, store.get);

/**
 * A value derived from the trial z (e.g. which solution the comb sits on): the component renders
 * only when that value changes, not on every step of a drag. `derive` must return a primitive.
 */
export function useTrialZDerived<T extends string | number | boolean | null>(store: TrialZStore, derive: (z: number) => T): T {
  return useSyncExternalStore(store.subscribe, () => derive(store.get()));
}

/**
 * The trial z at most once per animation frame: for heavier views (feature panels, the lines
 * list) that would otherwise re-render several times within one frame of a fast drag.
 */
export function useTrialZPerFrame(store: TrialZStore): number {
  const [z, setZ] = useState(store.get);
  useEffect(() => {
    let frame = 0;
    setZ(store.get());
    const unsubscribe = store.subscribe(() => {
      if (frame) return;
      frame = requestAnimationFrame(() => {
        frame = 0;
        setZ(store.get());
      });
    });
    return () => {
      unsubscribe();
      cancelAnimationFrame(frame);
    };
  }, [store]);
  return z;
}
