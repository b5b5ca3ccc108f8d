import { confirmedIdResponseSchema } from '@contracts/release';
import type { CorrectionRequest } from '@contracts/release';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { confirmedKeys } from './keys';

export const correctConfirmed = (spectrumId: number, body: CorrectionRequest) => api.post(`/api/spectra/${spectrumId}/corrections`, body, confirmedIdResponseSchema);

export function useCorrectConfirmed(spectrumId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CorrectionRequest) => correctConfirmed(spectrumId, body),
    // The history gains a record and every table of the campaign may show the new value.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: confirmedKeys.all() }),
  });
}
