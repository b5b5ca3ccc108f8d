/**
 * Whether a part of the page is on screen, for canvases inside it that repaint on every frame of a
 * drag and on every new spectrum: while it is off screen they only note that they are stale
 * (`paintOrDefer`), and they paint once when it comes back into view. Starts visible, so content
 * shows at once until an observer says otherwise.
 */
export interface ViewGate {
  readonly visible: boolean;
  set: (visible: boolean) => void;
  /** Paints now when visible; otherwise keeps `paint` (the latest one per key) for when it is. */
  paintOrDefer: (key: object, paint: () => void) => void;
  /** Forgets a deferred paint (its canvas is gone). */
  forget: (key: object) => void;
}

export function createViewGate(initiallyVisible = true): ViewGate {
  let visible = initiallyVisible;
  const deferred = new Map<object, () => void>();
  return {
    get visible() {
      return visible;
    },
    set: (next) => {
      if (next === visible) return;
      visible = next;
      if (!visible) return;
      const due = [...deferred.values()];
      deferred.clear();
      for (const paint of due) paint();
    },
    paintOrDefer: (key, paint) => {
      if (visible) paint();
      else deferred.set(key, paint);
    },
    forget: (key) => void deferred.delete(key),
  };
}
