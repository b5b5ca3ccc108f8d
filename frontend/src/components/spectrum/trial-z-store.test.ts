import { describe, expect, it } from 'vitest';
import { createTrialZStore } from './trial-z-store';
import type { FrameScheduler } from './trial-z-store';

/** Frames run when the test says so. */
function manualFrames() {
  const queue = new Map<number, () => void>();
  let next = 1;
  const frames: FrameScheduler = {
    request: (cb) => (queue.set(next, cb), next++),
    cancel: (h) => void queue.delete(h),
  };
  const run = () => {
    const due = [...queue.values()];
    queue.clear();
    for (const cb of due) cb();
  };
  return { frames, run, pending: () => queue.size };
}

describe('createTrialZStore', () => {
  it('tells its listeners once per frame, with the latest z, however many moves came', () => {
    const { frames, run } = manualFrames();
    const store = createTrialZStore(1, 0, 9, frames);
    const heard: number[] = [];
    store.subscribe((z) => heard.push(z));
    store.set(1.1);
    store.set(1.2);
    store.set(1.3);
    expect(store.get()).toBe(1.3);
    expect(heard).toEqual([]);
    run();
    expect(heard).toEqual([1.3]);
    run();
    expect(heard).toEqual([1.3]);
  });

  it('clamps to the range, ignores non-numbers and repeats, and asks for no frame without listeners', () => {
    const { frames, pending, run } = manualFrames();
    const store = createTrialZStore(20, 0, 9, frames);
    expect(store.get()).toBe(9);
    store.set(-3);
    expect(store.get()).toBe(0);
    store.set(Number.NaN);
    expect(store.get()).toBe(0);
    expect(pending()).toBe(0);
    const off = store.subscribe(() => {});
    store.set(0);
    expect(pending()).toBe(0);
    store.set(2);
    expect(pending()).toBe(1);
    off();
    expect(pending()).toBe(0);
    run();
  });
});
