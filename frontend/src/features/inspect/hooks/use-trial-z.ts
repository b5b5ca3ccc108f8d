import { useCallback, useSyncExternalStore } from 'react';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';

/**
 * The trial z, for small things that show it (the input, the reading's z). The store notifies at
 * most once per animation frame, so a fast drag re-renders these once per frame, in that frame.
 */
export const useTrialZ = (store: TrialZStore) => useSyncExternalStore(store.subscribe, store.get);

/**
 * A value derived from the trial z (e.g. which solution the comb sits on): the component renders
 * only when that value changes, not on every step of a drag. `derive` must return a primitive.
 */
export function useTrialZDerived<T extends string | number | boolean | null>(store: TrialZStore, derive: (z: number) => T): T {
  return useSyncExternalStore(store.subscribe, () => derive(store.get()));
}

/** How long the comb must rest before settled views follow it (ms). */
export const SETTLE_MS = 150;

/**
 * A value derived from the trial z that follows the comb once it rests (no move for SETTLE_MS):
 * for views that would change on almost every frame of a drag and cost a layout each time, but
 * are only read when the comb stops (the list of lines on data). `derive` must return a primitive.
 */
export function useTrialZSettled<T extends string | number | boolean | null>(store: TrialZStore, derive: (z: number) => T, delayMs = SETTLE_MS): T {
  const subscribe = useCallback(
    (notify: () => void) => {
      let timer = 0;
      const unsubscribe = store.subscribe(() => {
        clearTimeout(timer);
        timer = window.setTimeout(notify, delayMs);
      });
      return () => {
        clearTimeout(timer);
        unsubscribe();
      };
    },
    [store, delayMs],
  );
  return useSyncExternalStore(subscribe, () => derive(store.get()));
}
