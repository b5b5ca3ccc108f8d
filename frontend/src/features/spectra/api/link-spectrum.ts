import { linkSpectrumResponseSchema } from '@contracts/targets';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import { spectraKeys } from './keys';

export type LinkSpectrumResponse = z.infer<typeof linkSpectrumResponseSchema>;

export const linkSpectrum = (spectrumId: number, targetId: number | null): Promise<LinkSpectrumResponse> =>
  api.patch(`/api/spectra/${spectrumId}/target`, { targetId }, linkSpectrumResponseSchema);

export function useLinkSpectrum(campaignId: number, onLinked?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ spectrumId, targetId }: { spectrumId: number; targetId: number | null }) => linkSpectrum(spectrumId, targetId),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: spectraKeys.lists(campaignId) });
      onLinked?.();
    },
  });
}
