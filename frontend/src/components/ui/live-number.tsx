import { forwardRef } from 'react';
import type { ReactNode } from 'react';

/**
 * A number that changes on every frame of a drag (the trial z and what follows from it), in a box
 * of fixed size with strict containment: a new value re-lays out this box alone, not the panel
 * and page around it. `chars` is the widest text it will hold (monospaced digits). Without
 * children its text is left to whoever holds the ref (e.g. `useTrialZText`), so it can change
 * every frame without a React render.
 */
export const LiveNumber = forwardRef<HTMLSpanElement, { chars: number; className?: string; children?: ReactNode }>(function LiveNumber({ chars, className = '', children }, ref) {
  return (
    <span ref={ref} className={`num inline-block h-[1lh] overflow-hidden align-top whitespace-nowrap contain-strict ${className}`} style={{ width: `${chars}ch` }}>
      {children}
    </span>
  );
});
