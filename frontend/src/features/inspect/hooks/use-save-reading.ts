import { submitReadingRequestSchema } from '@contracts/readings';
import type { Reading, SubmitReadingRequest } from '@contracts/readings';
import { useRef, useState } from 'react';
import { useSubmitReading } from '../api/submit-reading';
import type { Solution } from '../api/schemas';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';
import type { ReadingDraft } from './use-reading-draft';
import { usePerSpectrum } from './use-per-spectrum';

interface Options {
  spectrumId: number;
  campaignId: number;
  store: TrialZStore;
  solutions: Solution[];
  /** Lines the save sends, computed at the moment of saving (the comb may have just moved; their measurement may still be on its way). */
  lines: () => Promise<string[]>;
  onSaved: (reading: Reading) => void;
}

/**
 * Builds the request from the comb and the draft, checks it with the shared contract before it
 * leaves, and measures the time spent from opening the spectrum (the first render that showed it).
 * A problem or a failed save belongs to its spectrum: moving on clears it.
 */
export function useSaveReading({ spectrumId, campaignId, store, solutions, lines, onSaved }: Options) {
  const [openedAt] = usePerSpectrum(spectrumId, () => performance.now());
  const mutation = useSubmitReading(spectrumId, campaignId);
  const [problem, setProblem] = usePerSpectrum<string | null>(spectrumId, () => null);
  const [sentFor, setSentFor] = useState<number | null>(null);
  // Set while the lines are fetched, before the mutation is pending: a second Enter then does nothing.
  const preparing = useRef(false);

  const save = async (draft: ReadingDraft, gradeOverride?: string) => {
    if (mutation.isPending || preparing.current) return;
    const grade = gradeOverride ?? draft.grade;
    if (grade === null) {
      setProblem('Choose a grade first: press its digit, or Shift + digit to grade and save at once.');
      return;
    }
    const trial = store.get();
    // A snapped comb carries the solution's exact z and its error; a dragged one is read to 5 decimals.
    const snapped = solutions.find((s) => s.z === trial);
    let used: string[];
    preparing.current = true;
    try {
      used = await lines();
    } catch (err) {
      setProblem(`The lines could not be measured, so nothing was saved: ${err instanceof Error ? err.message : String(err)}`);
      return;
    } finally {
      preparing.current = false;
    }
    const body: SubmitReadingRequest = {
      z: snapped ? snapped.z : Math.round(trial * 1e5) / 1e5,
      grade,
      class: draft.cls,
      lines: used,
      timeSpentMs: Math.round(performance.now() - openedAt),
      ...(snapped && snapped.zErr > 0 && snapped.zErr <= 1 ? { zErr: snapped.zErr } : {}),
      ...(draft.note.trim() ? { note: draft.note.trim() } : {}),
    };
    const checked = submitReadingRequestSchema.safeParse(body);
    if (!checked.success) {
      setProblem(checked.error.issues[0]?.message ?? 'The reading is not complete.');
      return;
    }
    setProblem(null);
    setSentFor(spectrumId);
    mutation.mutate(body, { onSuccess: ({ reading }) => onSaved(reading) });
  };

  const mine = sentFor === spectrumId;
  return { save, pending: mine && mutation.isPending, error: problem ? new Error(problem) : mine ? mutation.error : null };
}
