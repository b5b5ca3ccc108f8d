import { useEffect, useState } from 'react';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';

/**
 * Says when the trial z lies outside the target's photometric 95 % interval. It re-renders only
 * when that flips (the store notifies once per frame during a comb drag).
 */
export function PhotoZNotice({ store, z95 }: { store: TrialZStore; z95: [number, number] }) {
  const [lo, hi] = z95;
  const [isOutside, setOutside] = useState(() => store.get() < lo || store.get() > hi);
  useEffect(() => {
    const check = () => setOutside(store.get() < lo || store.get() > hi);
    check();
    return store.subscribe(check);
  }, [store, lo, hi]);
  return (
    <p role="status" className={`text-xs ${isOutside ? 'font-medium text-warning-700' : 'text-ink-600'}`}>
      {isOutside
        ? `The trial z lies outside the photometric 95 % interval (${lo.toFixed(2)}–${hi.toFixed(2)}): check the interloper and star solutions.`
        : `P(z) from the catalogue photometry (shaded; 95 %: ${lo.toFixed(2)}–${hi.toFixed(2)}) contains the trial z.`}
    </p>
  );
}
