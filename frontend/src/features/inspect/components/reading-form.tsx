import type { Reading, SpectrumClass } from '@contracts/readings';
import type { Grade } from '@contracts/grades';
import type { RefObject } from 'react';
import { Button } from '@/components/ui/button';
import { controlClass } from '@/components/ui/field';
import { LiveNumber } from '@/components/ui/live-number';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { formatDateTime, formatRedshift } from '@/lib/format';
import type { ReadingDraft } from '../hooks/use-reading-draft';
import { useTrialZText } from '../hooks/use-trial-z';
import type { Solution } from '../api/schemas';
import { LinesMeasuredField } from './lines-measured-field';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';
import { CLASS_NAMES, CLASS_ORDER } from '@/lib/spectrum-class';

interface Props {
  spectrumId: number;
  store: TrialZStore;
  /** The scan's solutions: a comb snapped to one carries its error. */
  solutions: Solution[];
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

/** The reader's verdict: z from the comb, grade from the campaign's scheme, class, the lines measured, note. */
export function ReadingForm({ spectrumId, store, solutions, scheme, draft, onDraft, mine, pending, error, onSave, noteRef }: Props) {
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
      <LinesMeasuredField spectrumId={spectrumId} store={store} solutions={solutions} draft={draft} onDraft={onDraft} />
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
