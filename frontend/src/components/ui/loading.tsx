/** A quiet placeholder; role=status lets screen readers hear that something is on its way. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="flex items-center gap-2 py-6 text-base text-ink-500">
      <span aria-hidden="true" className="inline-block size-3 animate-pulse rounded-full bg-ember-400" />
      {label}
    </p>
  );
}
