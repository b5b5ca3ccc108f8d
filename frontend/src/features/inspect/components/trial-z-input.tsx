import { forwardRef, useState } from 'react';
import { controlClass } from '@/components/ui/field';
import { LiveNumber } from '@/components/ui/live-number';
import { useTrialZ } from '../hooks/use-trial-z';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';

/**
 * The comb's redshift as text. It follows drags and keys to 5 decimals; while the reader types,
 * every parseable value moves the comb at once, and the typed text is kept until they leave.
 */
export const TrialZInput = forwardRef<HTMLInputElement, { store: TrialZStore }>(function TrialZInput({ store }, ref) {
  const z = useTrialZ(store);
  const [draft, setDraft] = useState<string | null>(null);
  const value = draft ?? z.toFixed(5);
  const parsed = draft === null ? z : Number(draft);
  const invalid = draft !== null && (draft.trim() === '' || !Number.isFinite(parsed) || parsed < store.min || parsed > store.max);

  return (
    <div className="flex flex-col gap-1">
      <label htmlFor="trial-z" className="text-sm font-medium text-ink-800">
        Trial redshift
      </label>
      <input
        ref={ref}
        id="trial-z"
        inputMode="decimal"
        autoComplete="off"
        spellCheck={false}
        value={value}
        aria-invalid={invalid || undefined}
        aria-describedby="trial-z-hint"
        onChange={(e) => {
          setDraft(e.target.value);
          const v = Number(e.target.value);
          if (e.target.value.trim() !== '' && Number.isFinite(v) && v >= store.min && v <= store.max) store.set(v);
        }}
        onBlur={() => setDraft(null)}
        onKeyDown={(e) => {
          if (e.key === 'Enter' || e.key === 'Escape') {
            setDraft(null);
            e.currentTarget.blur();
          }
        }}
        className={`${controlClass} num w-32 text-md`}
      />
      <p id="trial-z-hint" className="text-xs text-ink-500">
        {invalid ? (
          <span className="text-danger-700">
            A number from {store.min} to {store.max}.
          </span>
        ) : (
          <>
            1 + z = <LiveNumber chars={8}>{(1 + z).toFixed(5)}</LiveNumber>
          </>
        )}
      </p>
    </div>
  );
});
