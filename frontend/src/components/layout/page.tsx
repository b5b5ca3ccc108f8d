import type { ReactNode } from 'react';

/** Every page has one h1; actions sit beside it so the primary task is never below the fold. */
export function Page({
  title,
  eyebrow,
  subtitle,
  actions,
  children,
}: {
  title: ReactNode;
  eyebrow?: ReactNode;
  subtitle?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
}) {
  return (
    <div className="mx-auto flex w-full max-w-6xl flex-col gap-5 px-5 py-6">
      {/* React hoists <title> into <head>; tabs and history entries then say which page they are. */}
      {typeof title === 'string' ? <title>{`${title} · Redward`}</title> : null}
      <header className="flex flex-wrap items-end justify-between gap-3 border-b border-paper-300 pb-3">
        <div className="min-w-0">
          {eyebrow ? <div className="mb-0.5 text-sm text-ink-500">{eyebrow}</div> : null}
          <h1 className="text-xl font-semibold text-ink-950">{title}</h1>
          {subtitle ? <div className="mt-1 text-ink-600">{subtitle}</div> : null}
        </div>
        {actions ? <div className="flex items-center gap-2">{actions}</div> : null}
      </header>
      {children}
    </div>
  );
}
