import type { ReactNode } from 'react';

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-panel border border-dashed border-paper-300 bg-paper-50/60 px-4 py-6 text-center">
      <p className="font-medium text-ink-800">{title}</p>
      {children ? <div className="mt-1 text-ink-500">{children}</div> : null}
    </div>
  );
}
