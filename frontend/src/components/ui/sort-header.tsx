import type { ReactNode } from 'react';
import { thClass } from './table';

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

/** A sortable table column heading: the th carries aria-sort, the label is the sort button. */
export function SortableTh({ children, state, onToggle, alignRight }: { children: ReactNode; state: SortState; onToggle: ((event: unknown) => void) | undefined; alignRight: boolean }) {
  return (
    <th scope="col" aria-sort={ariaSort(state)} className={`${thClass} whitespace-nowrap ${alignRight ? 'text-right' : ''}`}>
      <SortHeader state={state} onToggle={onToggle}>
        {children}
      </SortHeader>
    </th>
  );
}
