import type { ReactNode } from 'react';

export type SortState = 'asc' | 'desc' | false;

/** The value for a th's aria-sort, so the current order is announced with the column. */
export const ariaSort = (state: SortState) => (state === 'asc' ? 'ascending' : state === 'desc' ? 'descending' : undefined);

/**
 * A column heading that sorts when pressed. It is a real button (keyboard and screen
 * reader), and the arrow is decoration: the order is carried by aria-sort on the th.
 */
export function SortHeader({ children, state, onToggle }: { children: ReactNode; state: SortState; onToggle: ((event: unknown) => void) | undefined }) {
  if (!onToggle) return <>{children}</>;
  return (
    <button type="button" onClick={onToggle} className="inline-flex items-center gap-1 rounded-control uppercase tracking-wide hover:text-ink-900">
      {children}
      <span aria-hidden="true" className={state ? 'text-ember-600' : 'text-ink-300'}>
        {state === 'asc' ? '▲' : state === 'desc' ? '▼' : '↕'}
      </span>
    </button>
  );
}
