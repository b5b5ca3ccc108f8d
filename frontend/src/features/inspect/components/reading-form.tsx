import type { Reading, SpectrumClass } from '@contracts/readings';
import type { Grade } from '@contracts/grades';
import type { RefObject } from 'react';
import { Button } from '@/components/ui/button';
import { controlClass } from '@/components/ui/field';
import { LiveNumber } from '@/components/ui/live-number';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { formatDateTime, formatRedshift } from '@/lib/format';
import type { ReadingDraft } from '../hooks/use-reading-draft';
import { useTrialZSettled, useTrialZText } from '../hooks/use-trial-z';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';
import { CLASS_NAMES, CLASS_ORDER } from '@/lib/spectrum-class';

interface Props {
  store: TrialZStore;
  /** The comb's lines on usable data at a redshift. */
  onDataAt: (z: number) => string[];
  scheme: Grade[];
  draft: ReadingDraft;
  onDraft: (update: (d: ReadingDraft) => ReadingDraft) => void;
  mine: Reading | undefined;
  pending: boolean;
  error: unknown;
  onSave: () => void;
  noteRef: RefObject<HTMLTextAreaElement | null>;
}

const kbd = 'num rounded-control border border-paper-400 bg-paper-100 px-1 text-xs';

/** The reader's verdict: z from the comb, grade from the campaign's scheme, class, lines, note. */
export function ReadingForm({ store, onDataAt, scheme, draft, onDraft, mine, pending, error, onSave, noteRef }: Props) {
  return (
    <form
      aria-label="Reading"
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        onSave();
      }}
    >
      {mine ? (
        <Notice tone="info" role="status">
          Your reading: <span className="num">z = {formatRedshift(mine.z)}</span>, grade {mine.grade}, {CLASS_NAMES[mine.class]} — revision {mine.revision}
          {mine.locked ? ' (confirmed, locked)' : ''}, saved {formatDateTime(mine.updatedAt)}.
        </Notice>
      ) : null}
      <p className="text-sm text-ink-700">
        Redshift from the comb: <CombZ store={store} />
      </p>
      {/* min-w-0: a fieldset is otherwise as wide as its longest line and pushes out of the card. */}
      <fieldset className="min-w-0">
        <legend className="mb-1 text-sm font-medium text-ink-800">Grade</legend>
        <div className="flex flex-col gap-0.5">
          {scheme.map((g, i) => (
            <label key={g.code} className="flex min-w-0 cursor-pointer flex-wrap items-baseline gap-x-2 rounded-control px-1 py-0.5 hover:bg-paper-200 has-[:checked]:bg-ember-50">
              <input type="radio" name="grade" value={g.code} checked={draft.grade === g.code} onChange={() => onDraft((d) => ({ ...d, grade: g.code }))} className="accent-ember-600" />
              {/* The digit key of the grade: its code in older digit schemes, else its place. */}
              <kbd className="num font-semibold" title="Its key">
                {/^\d+$/.test(g.code) ? g.code : i + 1}
              </kbd>
              <span>{g.label}</span>
              {g.code.toLowerCase() !== g.label.toLowerCase() && !/^\d+$/.test(g.code) ? <span className="num text-xs text-ink-500">{g.code}</span> : null}
              {/* The meaning wraps on its own line: readers grade by it, so it is never cut off. */}
              <span className="basis-full pl-6 text-xs text-ink-500">{g.meaning}</span>
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex flex-col gap-1">
        <label htmlFor="reading-class" className="text-sm font-medium text-ink-800">
          Class
        </label>
        <select id="reading-class" value={draft.cls} onChange={(e) => onDraft((d) => ({ ...d, cls: e.target.value as SpectrumClass }))} className={`${controlClass} py-1`}>
          {CLASS_ORDER.map((c) => (
            <option key={c} value={c}>
              {CLASS_NAMES[c]}
            </option>
          ))}
        </select>
      </div>
      <LinesUsedField store={store} onDataAt={onDataAt} draft={draft} onDraft={onDraft} />
      <div className="flex flex-col gap-1">
        <label htmlFor="reading-note" className="text-sm font-medium text-ink-800">
          Note
        </label>
        <textarea
          id="reading-note"
          ref={noteRef}
          rows={2}
          value={draft.note}
          maxLength={4000}
          onChange={(e) => onDraft((d) => ({ ...d, note: e.target.value }))}
          onKeyDown={(e) => e.key === 'Escape' && e.currentTarget.blur()}
          className={controlClass}
        />
      </div>
      <ErrorNotice error={error} title="The reading was not saved" />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" pending={pending} pendingLabel="Saving…" disabled={mine?.locked}>
          {mine ? 'Save revision and next' : 'Save reading and next'}
        </Button>
        <span className="text-xs text-ink-500">
          <kbd className={kbd}>Enter</kbd> saves · <kbd className={kbd}>Shift</kbd>+<kbd className={kbd}>grade</kbd> grades and saves · <kbd className={kbd}>?</kbd> all keys
        </span>
      </div>
    </form>
  );
}

/** Follows the comb on every frame of a drag without a React render (useTrialZText). */
function CombZ({ store }: { store: TrialZStore }) {
  return <LiveNumber ref={useTrialZText<HTMLSpanElement>(store, formatRedshift)} chars={8} className="text-md font-semibold text-ink-900" />;
}

/**
 * The lines list follows the comb once it rests: during a drag the set of lines on unmasked data
 * changes on almost every frame, and re-laying out the list each time would cost more than the
 * frame. A save always reads the lines at the comb's position of that moment.
 */
function LinesUsedField({ store, onDataAt, draft, onDraft }: Pick<Props, 'store' | 'onDataAt' | 'draft' | 'onDraft'>) {
  const joined = useTrialZSettled(store, (z) => onDataAt(z).join('\n'));
  const onData = joined ? joined.split('\n') : [];
  const shown = [...new Set([...onData, ...draft.added])];
  const checked = (name: string) => (onData.includes(name) ? !draft.excluded.has(name) : draft.added.has(name));
  const toggle = (name: string, on: boolean) =>
    onDraft((d) => {
      const excluded = new Set(d.excluded);
      const added = new Set(d.added);
      if (onData.includes(name)) {
        if (on) excluded.delete(name);
        else excluded.add(name);
      } else if (on) added.add(name);
      else added.delete(name);
      return { ...d, excluded, added };
    });
  return (
    <fieldset>
      <legend className="mb-1 flex w-full items-baseline justify-between text-sm font-medium text-ink-800">
        <span>Lines used</span>
        <span className="text-xs font-normal text-ink-500">comb markers on data at this z</span>
      </legend>
      {shown.length === 0 ? (
        <p className="text-sm text-ink-500">No comb marker falls on usable data here.</p>
      ) : (
        <div className="flex max-h-40 flex-wrap gap-x-3 gap-y-0.5 overflow-y-auto rounded-control border border-paper-200 p-1.5">
          {shown.map((name) => (
            <label key={name} className="flex items-center gap-1 text-sm">
              <input type="checkbox" checked={checked(name)} onChange={(e) => toggle(name, e.target.checked)} className="accent-ink-900" />
              {name}
            </label>
          ))}
        </div>
      )}
      <div className="mt-1 flex gap-2">
        <Button variant="quiet" size="sm" onClick={() => onDraft((d) => ({ ...d, excluded: new Set(onData), added: new Set() }))}>
          Untick all
        </Button>
        <Button variant="quiet" size="sm" onClick={() => onDraft((d) => ({ ...d, excluded: new Set() }))}>
          Tick all on data
        </Button>
      </div>
    </fieldset>
  );
}
