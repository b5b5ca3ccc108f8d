import type { ReactNode } from 'react';

/**
 * A number that changes on every frame of a drag (the trial z and what follows from it), in a box
 * of fixed size with strict containment: a new value re-lays out this box alone, not the panel
 * and page around it. `chars` is the widest text it will hold (monospaced digits).
 */
export function LiveNumber({ chars, className = '', children }: { chars: number; className?: string; children: ReactNode }) {
  return (
    <span className={`num inline-block h-[1lh] overflow-hidden align-top whitespace-nowrap contain-strict ${className}`} style={{ width: `${chars}ch` }}>
      {children}
    </span>
  );
}
