import type { Reading } from '@contracts/readings';
import { useLocation } from 'react-router-dom';
import { gradeText } from '@/lib/grade-label';
import type { SpectrumDetail } from '../api/schemas';

/** The reading just saved travels to the next spectrum in the history state, so the reader sees it landed. */
export interface SavedFlash {
  saved: { reading: Reading; fileName: string; gradeLabel: string };
}

export function useSavedFlash(): SavedFlash['saved'] | null {
  const state = useLocation().state as Partial<SavedFlash> | null;
  return state?.saved ?? null;
}

export const savedFlash = (reading: Reading, detail: SpectrumDetail): SavedFlash => ({
  saved: {
    reading,
    fileName: detail.target?.catalogueId ?? detail.spectrum.fileName,
    gradeLabel: gradeText(detail.campaign.gradeScheme, reading.grade),
  },
});
