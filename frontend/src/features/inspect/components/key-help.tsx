import { useEffect, useRef } from 'react';
import { Button } from '@/components/ui/button';
import { KEY_MAP } from '../utils/key-map';

const kbd = 'num inline-block min-w-6 rounded-control border border-paper-400 bg-paper-100 px-1.5 text-center text-xs text-ink-900 shadow-[inset_0_-1px_0_var(--color-paper-400)]';

/** The key map in a modal dialog; Escape, ? or the button close it and focus returns where it was. */
export function KeyHelp({ open, onClose }: { open: boolean; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current!;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby="key-help-title"
      onClose={onClose}
      onKeyDown={(e) => {
        if (e.key === '?') {
          e.preventDefault();
          onClose();
        }
      }}
      className="m-auto max-h-[85vh] w-[min(46rem,92vw)] rounded-panel border border-paper-300 bg-paper-50 p-5 text-ink-900 backdrop:bg-ink-950/40"
    >
      <div className="mb-3 flex items-baseline justify-between gap-3">
        <h2 id="key-help-title" className="text-lg font-semibold">
          Keys of the inspection screen
        </h2>
        <Button variant="secondary" size="sm" onClick={onClose} autoFocus>
          Close
        </Button>
      </div>
      <p className="mb-3 text-sm text-ink-600">
        Keys work whenever the cursor is not in a text field. The comb opens on the top solution, so agreeing with it is one key: <kbd className={kbd}>Shift</kbd> +{' '}
        <kbd className={kbd}>grade</kbd>. After moving the comb away, <kbd className={kbd}>t</kbd> brings it back first.
      </p>
      <div className="grid gap-x-8 gap-y-4 sm:grid-cols-2">
        {KEY_MAP.map((group) => (
          <section key={group.title}>
            <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-500">{group.title}</h3>
            <dl className="flex flex-col gap-1">
              {group.bindings.map((b) => (
                <div key={b.does} className="flex items-baseline gap-3">
                  <dt className="flex w-28 shrink-0 flex-wrap gap-1">
                    {b.keys.map((k) => (
                      <kbd key={k} className={kbd}>
                        {k}
                      </kbd>
                    ))}
                  </dt>
                  <dd className="text-sm">{b.does}</dd>
                </div>
              ))}
            </dl>
          </section>
        ))}
      </div>
    </dialog>
  );
}
