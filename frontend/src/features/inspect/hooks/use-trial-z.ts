import { useCallback, useLayoutEffect, useRef, useSyncExternalStore } from 'react';
import type { RefObject } from 'react';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';

/**
 * Text that follows the trial z on every frame of a drag, written into the element's text node by
 * the store's per-frame notification rather than through a React render: the element (a
 * `LiveNumber`) must leave its content to this hook. Returns the ref to put on it.
 */
export function useTrialZText<E extends HTMLElement>(store: TrialZStore, format: (z: number) => string): RefObject<E | null> {
  const ref = useRef<E>(null);
  const formatRef = useRef(format);
  formatRef.current = format;
  useLayoutEffect(() => {
    const write = () => {
      const el = ref.current;
      if (el) writeText(el, formatRef.current(store.get()));
    };
    write();
    return store.subscribe(write);
  }, [store]);
  return ref;
}

/** Replaces an element's text, reusing its text node (cheaper than a new one on every frame) and skipping equal text. */
export function writeText(el: HTMLElement, text: string) {
  const node = el.firstChild;
  if (node !== null && node === el.lastChild && node.nodeType === 3) {
    if ((node as Text).data !== text) (node as Text).data = text;
  } else el.textContent = text;
}

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
