import type { Reading, SpectrumClass } from '@contracts/readings';
import { usePerSpectrum } from './use-per-spectrum';

/** What the reader is composing; z is not here, it is the comb's (see TrialZStore). */
export interface ReadingDraft {
  grade: string | null;
  cls: SpectrumClass;
  /** Lines detected in the data (≥ 3σ, measured by the server) that the reader unticked; the other detected lines count as used. */
  excluded: ReadonlySet<string>;
  /** Lines ticked by hand that are not detected at this z (kept so a tick is never lost). */
  added: ReadonlySet<string>;
  note: string;
}

/** Starts from the reader's saved reading when there is one, else from the top solution's class; a new one per spectrum. */
export function useReadingDraft(spectrumId: number, mine: Reading | undefined, topClass: SpectrumClass) {
  return usePerSpectrum<ReadingDraft>(spectrumId, () => ({
    grade: mine?.grade ?? null,
    cls: mine?.class ?? topClass,
    excluded: new Set(),
    added: new Set(),
    note: mine?.note ?? '',
  }));
}

/** The lines a save sends: the detected lines minus the unticked, plus the hand-ticked. */
export const linesUsed = (detected: string[], d: ReadingDraft) => [...new Set([...detected.filter((n) => !d.excluded.has(n)), ...d.added])];
