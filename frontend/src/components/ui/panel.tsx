import type { ReactNode } from 'react';

/** A titled section of a page; the heading level is chosen by the caller to keep the outline right. */
export function Panel({
  title,
  level = 2,
  actions,
  children,
  className,
}: {
  title?: string;
  level?: 2 | 3;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  const Heading = level === 2 ? 'h2' : 'h3';
  return (
    <section className={`rounded-panel border border-paper-300 bg-paper-50 p-4 ${className ?? ''}`}>
      {title || actions ? (
        <div className="mb-3 flex items-baseline justify-between gap-3">
          {title ? <Heading className="text-md font-semibold text-ink-900">{title}</Heading> : <span />}
          {actions}
        </div>
      ) : null}
      {children}
    </section>
  );
}
