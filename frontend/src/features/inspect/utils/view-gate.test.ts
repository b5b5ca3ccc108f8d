import { describe, expect, it } from 'vitest';
import { createViewGate } from './view-gate';

describe('createViewGate', () => {
  it('paints at once while visible (the initial state)', () => {
    const gate = createViewGate();
    const painted: string[] = [];
    gate.paintOrDefer({}, () => painted.push('a'));
    expect(gate.visible).toBe(true);
    expect(painted).toEqual(['a']);
  });

  it('defers paints while hidden and runs only the latest one per key when shown again', () => {
    const gate = createViewGate();
    const a = {};
    const b = {};
    const painted: string[] = [];
    gate.set(false);
    gate.paintOrDefer(a, () => painted.push('a1'));
    gate.paintOrDefer(a, () => painted.push('a2'));
    gate.paintOrDefer(b, () => painted.push('b1'));
    expect(painted).toEqual([]);
    gate.set(true);
    expect(painted).toEqual(['a2', 'b1']);
    gate.set(false);
    gate.set(true);
    expect(painted).toEqual(['a2', 'b1']);
  });

  it('can start hidden', () => {
    const gate = createViewGate(false);
    const painted: string[] = [];
    gate.paintOrDefer({}, () => painted.push('a'));
    expect(painted).toEqual([]);
    gate.set(true);
    expect(painted).toEqual(['a']);
  });

  it('drops a deferred paint that was forgotten', () => {
    const gate = createViewGate();
    const a = {};
    const painted: string[] = [];
    gate.set(false);
    gate.paintOrDefer(a, () => painted.push('a'));
    gate.forget(a);
    gate.set(true);
    expect(painted).toEqual([]);
  });
});
