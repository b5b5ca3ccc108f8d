import { forwardRef, useImperativeHandle, useLayoutEffect, useRef, useState } from 'react';
import { controlClass } from '@/components/ui/field';
import { LiveNumber } from '@/components/ui/live-number';
import { useTrialZText } from '../hooks/use-trial-z';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';

const zText = (z: number) => z.toFixed(5);
const onePlusZText = (z: number) => (1 + z).toFixed(5);

/**
 * The comb's redshift as text. It follows drags and keys to 5 decimals; while the reader types,
 * every parseable value moves the comb at once, and the typed text is kept until they leave.
 * The field is written from the trial-z store's per-frame notification, not by a React render
 * (a drag would otherwise render this component on every frame); React renders it only when the
 * typed text changes.
 */
export const TrialZInput = forwardRef<HTMLInputElement, { store: TrialZStore }>(function TrialZInput({ store }, ref) {
  const input = useRef<HTMLInputElement>(null);
  useImperativeHandle(ref, () => input.current!, []);
  const [draft, setDraft] = useState<string | null>(null);
  const editing = useRef(false);
  editing.current = draft !== null;
  const parsed = draft === null ? store.get() : Number(draft);
  const invalid = draft !== null && (draft.trim() === '' || !Number.isFinite(parsed) || parsed < store.min || parsed > store.max);
  const onePlusZ = useTrialZText<HTMLSpanElement>(store, onePlusZText);

  // The field shows the store's z except while the reader is typing in it.
  useLayoutEffect(() => {
    const write = () => {
      const el = input.current;
      if (el && !editing.current) {
        const text = zText(store.get());
        if (el.value !== text) el.value = text;
      }
    };
    write();
    return store.subscribe(write);
  }, [store, draft]);

  return (
    <div className="flex flex-col gap-1">
      <label htmlFor="trial-z" className="text-sm font-medium text-ink-800">
        Trial redshift
      </label>
      {/* A box of fixed size with layout and size containment: a new value, every frame of a drag,
          re-lays out the field alone, not the toolbar and panels around it. */}
      <div className="h-[38px] w-32" style={{ contain: 'size layout' }}>
        <input
          ref={input}
          id="trial-z"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          defaultValue={zText(store.get())}
          aria-invalid={invalid || undefined}
          aria-describedby="trial-z-hint"
          onChange={(e) => {
            setDraft(e.target.value);
            editing.current = true;
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
          className={`${controlClass} num h-[38px] w-32 text-md`}
        />
      </div>
      <p id="trial-z-hint" className="text-xs text-ink-500">
        {invalid ? (
          <span className="text-danger-700">
            A number from {store.min} to {store.max}.
          </span>
        ) : null}
        {/* Kept mounted (hidden) while the typed text is invalid: its number is written by useTrialZText. */}
        <span hidden={invalid}>
          1 + z = <LiveNumber ref={onePlusZ} chars={8} />
        </span>
      </p>
    </div>
  );
});
