import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { reassignResponseSchema, spectrumAssignmentsSchema, type SpectrumAssignments } from '@contracts/release';
import { apiRequest, api } from '@/lib/api-client';
import { assignmentKeys } from './keys';

export const getSpectrumAssignments = (spectrumId: number, signal?: AbortSignal): Promise<SpectrumAssignments> =>
  api.get(`/api/spectra/${spectrumId}/assignments`, spectrumAssignmentsSchema, signal);

export const getSpectrumAssignmentsQueryOptions = (spectrumId: number) =>
  queryOptions({ queryKey: assignmentKeys.spectrum(spectrumId), queryFn: ({ signal }) => getSpectrumAssignments(spectrumId, signal) });

export const useSpectrumAssignments = (spectrumId: number) => useQuery(getSpectrumAssignmentsQueryOptions(spectrumId));

export const reassignReading = (spectrumId: number, readingOrder: 'first' | 'second', readerId: number) =>
  apiRequest(`/api/spectra/${spectrumId}/assignments`, { method: 'PUT', body: { readingOrder, readerId }, schema: reassignResponseSchema });

export function useReassignReading(spectrumId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ readingOrder, readerId }: { readingOrder: 'first' | 'second'; readerId: number }) => reassignReading(spectrumId, readingOrder, readerId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: assignmentKeys.spectrum(spectrumId) }),
  });
}
