import type { ReactNode } from 'react';

export interface Stat {
  term: string;
  value: ReactNode;
  /** Draws the eye to a count that needs action (failures, unlinked spectra). */
  attention?: boolean;
}

/** A row of labelled counts; numbers in the mono face so columns of them line up. */
export function Stats({ stats, label }: { stats: Stat[]; label?: string }) {
  return (
    <dl aria-label={label} className="grid grid-cols-2 gap-x-6 gap-y-2 min-[480px]:grid-cols-3 md:grid-cols-6">
      {stats.map((s) => (
        <div key={s.term} className="flex flex-col">
          <dt className="text-xs font-semibold uppercase tracking-wide text-ink-500">{s.term}</dt>
          <dd className={`num text-lg ${s.attention ? 'text-danger-700' : 'text-ink-900'}`}>{s.value}</dd>
        </div>
      ))}
    </dl>
  );
}
