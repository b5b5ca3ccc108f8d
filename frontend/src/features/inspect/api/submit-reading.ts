import { readingResponseSchema } from '@contracts/readings';
import type { Reading, SubmitReadingRequest } from '@contracts/readings';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { inspectKeys } from './keys';
import type { SpectrumDetail } from './schemas';

export const submitReading = (spectrumId: number, body: SubmitReadingRequest) =>
  api.post(`/api/spectra/${spectrumId}/readings`, body, readingResponseSchema);

export function useSubmitReading(spectrumId: number, campaignId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SubmitReadingRequest) => submitReading(spectrumId, body),
    onSuccess: ({ reading }) => {
      // The detail shows the reader's own reading; patch it in so going back shows it at once.
      queryClient.setQueryData<SpectrumDetail>(inspectKeys.detail(spectrumId), (d) => (d ? { ...d, readings: upsert(d.readings, reading) } : d));
      // Not awaited: the reader moves on at once; the queue catches up in the background.
      void queryClient.invalidateQueries({ queryKey: inspectKeys.queue(campaignId) });
    },
  });
}

const upsert = (readings: Reading[], reading: Reading) => [...readings.filter((r) => r.id !== reading.id), reading];
