import { useEffect, useRef } from 'react';
import type { SpectrumClass } from '@contracts/readings';

export interface InspectKeyActions {
  nudge: (pixels: number) => void;
  focusZ: () => void;
  takeTop: () => void;
  stepSolution: (delta: 1 | -1) => void;
  setGrade: (digit: number) => void;
  /** A digit key: the grade it names (grade-label.ts gradeForKey). */
  gradeAndSave: (digit: number) => void;
  save: () => void;
  setClass: (c: SpectrumClass) => void;
  focusNote: () => void;
  nextSpectrum: () => void;
  previousSpectrum: () => void;
  toggleSmoothing: () => void;
  toggleFrame: () => void;
  zoom: (factor: number) => void;
  pan: (fraction: number) => void;
  resetZoom: () => void;
  toggleTool: () => void;
  toggleHelp: () => void;
}

const CLASS_KEYS: Record<string, SpectrumClass> = { g: 'galaxy', q: 'quasar', s: 'star', b: 'lyman-break', u: 'unknown' };

/** Typing in a field must never trigger a shortcut. */
function isTyping(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable) return true;
  const tag = target.tagName;
  return tag === 'INPUT' || tag === 'TEXTAREA' || tag === 'SELECT';
}

/** Where Enter already means something (press this button, follow this link). */
const ownsEnter = (target: EventTarget | null) => target instanceof HTMLElement && !!target.closest('button, a, summary, [role="button"]');

/**
 * The key map of utils/key-map.ts. One listener on the window; the latest actions are read from a
 * ref so the listener is attached once per screen, not once per render.
 */
export function useInspectKeys(actions: InspectKeyActions, enabled = true) {
  const ref = useRef(actions);
  ref.current = actions;
  useEffect(() => {
    if (!enabled) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented || e.ctrlKey || e.metaKey || e.altKey || isTyping(e.target)) return;
      const a = ref.current;
      const digit = /^Digit(\d)$/.exec(e.code)?.[1];
      let handled = true;
      if (e.shiftKey && digit !== undefined) a.gradeAndSave(Number(digit));
      else if (!e.shiftKey && /^\d$/.test(e.key)) a.setGrade(Number(e.key));
      else if (e.key === 'ArrowLeft' || e.key === 'ArrowRight') a.nudge((e.key === 'ArrowRight' ? 1 : -1) * (e.shiftKey ? 10 : 1));
      else if (e.key === 'Enter') {
        if (ownsEnter(e.target)) return;
        a.save();
      } else if (e.key === '?') a.toggleHelp();
      else if (e.key === 'z') a.focusZ();
      else if (e.key === 't') a.takeTop();
      else if (e.key === 'n') a.stepSolution(1);
      else if (e.key === 'p') a.stepSolution(-1);
      else if (e.key in CLASS_KEYS) a.setClass(CLASS_KEYS[e.key]!);
      else if (e.key === 'e') a.focusNote();
      else if (e.key === ']') a.nextSpectrum();
      else if (e.key === '[') a.previousSpectrum();
      else if (e.key === 'm') a.toggleSmoothing();
      else if (e.key === 'f') a.toggleFrame();
      else if (e.key === '+' || e.key === '=') a.zoom(0.5);
      else if (e.key === '-' || e.key === '_') a.zoom(2);
      else if (e.key === ',') a.pan(-0.25);
      else if (e.key === '.') a.pan(0.25);
      else if (e.key === 'r') a.resetZoom();
      else if (e.key === 'd') a.toggleTool();
      else handled = false;
      if (handled) e.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [enabled]);
}
