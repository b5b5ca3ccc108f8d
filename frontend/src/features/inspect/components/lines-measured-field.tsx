import type { CombLines } from '@contracts/line-measurements';
import { LYA_CAVEAT } from '@contracts/line-measurements';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';
import { formatRedshiftError } from '@/lib/format';
import { measuredZ, useCombLines } from '../api/get-comb-lines';
import type { Solution } from '../api/schemas';
import { linesUsed, type ReadingDraft } from '../hooks/use-reading-draft';
import { measurementText } from '../utils/measurement-text';
import { useTrialZDerived, useTrialZSettled } from '../hooks/use-trial-z';

interface Props {
  spectrumId: number;
  store: TrialZStore;
  solutions: Solution[];
  draft: ReadingDraft;
  onDraft: (update: (d: ReadingDraft) => ReadingDraft) => void;
}

/**
 * The lines of the comb at the resting z, each measured by the server in the data: flux (or EW,
 * or break ratio) ± error, S/N and offset. Lines detected at ≥ 3σ are ticked; the reader can
 * tick or untick any. The list follows the comb once it rests (no request per frame of a drag).
 */
export function LinesMeasuredField({ spectrumId, store, solutions, draft, onDraft }: Props) {
  const z = useTrialZSettled(store, (t) => measuredZ(t, solutions));
  const query = useCombLines(spectrumId, z, draft.cls);
  const data = query.data;
  const detected = data ? data.lines.filter((m) => m.detected).map((m) => m.name) : [];
  const listed = new Set(data?.lines.map((m) => m.name) ?? []);
  const addedOff = [...draft.added].filter((n) => !listed.has(n));
  const checked = (name: string) => (detected.includes(name) ? !draft.excluded.has(name) : draft.added.has(name));
  const toggle = (name: string, on: boolean) =>
    onDraft((d) => {
      const excluded = new Set(d.excluded);
      const added = new Set(d.added);
      if (detected.includes(name)) {
        if (on) excluded.delete(name);
        else excluded.add(name);
      } else if (on) added.add(name);
      else added.delete(name);
      return { ...d, excluded, added };
    });
  const used = data ? linesUsed(detected, draft) : [];
  // What was seen first: the detected lines lead, the rest (on the data, below 3σ or not measurable) follow.
  const shown = data ? [...data.lines.filter((m) => m.detected), ...data.lines.filter((m) => !m.detected)] : [];
  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 flex w-full items-baseline justify-between text-sm font-medium text-ink-800">
        <span>Lines used</span>
        <span className="text-xs font-normal text-ink-500">measured in the data at this z; ticked when ≥ 3σ</span>
      </legend>
      {query.isError ? <p className="text-sm text-warning-700">The lines could not be measured: {query.error.message}</p> : null}
      {!data ? (
        <p className="text-sm text-ink-500">Measuring the lines at this z…</p>
      ) : data.lines.length === 0 && addedOff.length === 0 ? (
        <p className="text-sm text-ink-500">No comb line falls on the data here.</p>
      ) : (
        <ul aria-label="Lines measured" className="flex max-h-56 flex-col gap-0.5 overflow-y-auto rounded-control border border-paper-200 p-1.5">
          {shown.map((m) => (
            <li key={m.name} data-line={m.name} data-detected={m.detected} className="flex min-w-0 flex-wrap items-baseline gap-x-2 text-sm">
              <label className="flex items-center gap-1">
                <input type="checkbox" checked={checked(m.name)} onChange={(e) => toggle(m.name, e.target.checked)} className="accent-ink-900" />
                <span className={m.detected ? 'font-medium text-ink-900' : 'text-ink-600'}>{m.name}</span>
              </label>
              <span className="num text-xs text-ink-700" data-role="measure">
                {measurementText(m, data.fluxUnit)}
              </span>
              {m.snr !== null ? (
                <span className="num text-xs text-ink-700" data-role="snr">
                  S/N {m.snr.toFixed(1)}
                </span>
              ) : null}
              {m.offsetKms !== null ? (
                <span className="num text-xs text-ink-500" data-role="offset">
                  {m.offsetKms >= 0 ? '+' : '−'}
                  {Math.abs(Math.round(m.offsetKms))} km/s
                </span>
              ) : null}
              {m.blendedWith.length ? <span className="text-xs text-ink-500">blend with {m.blendedWith.join(', ')}</span> : null}
              {!m.detected && m.measured ? <span className="text-xs text-ink-500">below 3σ</span> : null}
            </li>
          ))}
          {addedOff.map((name) => (
            <li key={name} className="flex items-center gap-1 text-sm">
              <label className="flex items-center gap-1">
                <input type="checkbox" checked onChange={(e) => toggle(name, e.target.checked)} className="accent-ink-900" />
                {name}
              </label>
              <span className="text-xs text-ink-500">not on the data at this z</span>
            </li>
          ))}
        </ul>
      )}
      <div className="mt-1 flex gap-2">
        <Button variant="quiet" size="sm" onClick={() => onDraft((d) => ({ ...d, excluded: new Set(detected), added: new Set() }))}>
          Untick all
        </Button>
        <Button variant="quiet" size="sm" onClick={() => onDraft((d) => ({ ...d, excluded: new Set(), added: new Set() }))}>
          Tick the detected
        </Button>
      </div>
      {data ? <ReadingError store={store} solutions={solutions} data={data} /> : null}
      {data && (draft.cls === 'lyman-break' || (used.length > 0 && used.filter((n) => detected.includes(n)).join() === 'Ly-alpha')) ? (
        <Notice tone="warning" role="status">
          {LYA_CAVEAT}
        </Notice>
      ) : null}
    </fieldset>
  );
}

/**
 * The error the reading will carry: the snapped solution's error widened in quadrature by the
 * resolution floor (the floor alone for a dragged comb), as the server computes it on save.
 */
function ReadingError({ store, solutions, data }: { store: TrialZStore; solutions: Solution[]; data: CombLines }) {
  const engine = useTrialZDerived(store, (t) => solutions.find((s) => s.z === t)?.zErr ?? null);
  const err = engine !== null && engine > 0 ? Math.hypot(engine, data.zErrFloor) : data.zErrFloor;
  return (
    <p className="mt-1 text-xs text-ink-600" data-role="reading-error">
      Error of this reading: <span className="num">± {formatRedshiftError(err)}</span> ({engine !== null ? `engine ${formatRedshiftError(engine)} ⊕ ` : ''}resolution floor{' '}
      <span className="num">{formatRedshiftError(data.zErrFloor)}</span>, from the {data.resolution.from}).
    </p>
  );
}
