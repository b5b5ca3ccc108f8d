import { submitReadingRequestSchema } from '@contracts/readings';
import type { Reading, SubmitReadingRequest } from '@contracts/readings';
import { useRef, useState } from 'react';
import { useSubmitReading } from '../api/submit-reading';
import type { Solution } from '../api/schemas';
import type { TrialZStore } from '@/components/spectrum/trial-z-store';
import type { ReadingDraft } from './use-reading-draft';

interface Options {
  spectrumId: number;
  campaignId: number;
  store: TrialZStore;
  solutions: Solution[];
  /** Lines the save sends, computed at the moment of saving (the comb may have just moved). */
  lines: () => string[];
  onSaved: (reading: Reading) => void;
}

/**
 * Builds the request from the comb and the draft, checks it with the shared contract before it
 * leaves, and measures the time spent from opening the spectrum (this hook's first render).
 */
export function useSaveReading({ spectrumId, campaignId, store, solutions, lines, onSaved }: Options) {
  const openedAt = useRef(performance.now());
  const mutation = useSubmitReading(spectrumId, campaignId);
  const [problem, setProblem] = useState<string | null>(null);

  const save = (draft: ReadingDraft, gradeOverride?: number) => {
    if (mutation.isPending) return;
    const grade = gradeOverride ?? draft.grade;
    if (grade === null) {
      setProblem('Choose a grade first: press its digit, or Shift + digit to grade and save at once.');
      return;
    }
    const trial = store.get();
    // A snapped comb carries the solution's exact z and its error; a dragged one is read to 5 decimals.
    const snapped = solutions.find((s) => s.z === trial);
    const body: SubmitReadingRequest = {
      z: snapped ? snapped.z : Math.round(trial * 1e5) / 1e5,
      grade,
      class: draft.cls,
      lines: lines(),
      timeSpentMs: Math.round(performance.now() - openedAt.current),
      ...(snapped && snapped.zErr > 0 && snapped.zErr <= 1 ? { zErr: snapped.zErr } : {}),
      ...(draft.note.trim() ? { note: draft.note.trim() } : {}),
    };
    const checked = submitReadingRequestSchema.safeParse(body);
    if (!checked.success) {
      setProblem(checked.error.issues[0]?.message ?? 'The reading is not complete.');
      return;
    }
    setProblem(null);
    mutation.mutate(body, { onSuccess: ({ reading }) => onSaved(reading) });
  };

  return { save, pending: mutation.isPending, error: problem ? new Error(problem) : mutation.error };
}
