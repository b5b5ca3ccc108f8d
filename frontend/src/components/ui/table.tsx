import type { ComponentProps } from 'react';

/** Dense, ruled tables: the shape astronomers expect from a catalogue. */
export function Table({ caption, captionHidden, children, className }: ComponentProps<'table'> & { caption: string; captionHidden?: boolean }) {
  return (
    <div className="overflow-x-auto">
      <table className={`w-full border-collapse text-left text-base ${className ?? ''}`}>
        <caption className={captionHidden ? 'sr-only' : 'mb-2 text-left text-md font-semibold text-ink-900'}>{caption}</caption>
        {children}
      </table>
    </div>
  );
}

export const thClass = 'border-b border-paper-300 px-2 py-1.5 text-xs font-semibold uppercase tracking-wide text-ink-500';
export const tdClass = 'border-b border-paper-200 px-2 py-1.5 align-top';
