import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { rescanResponseSchema, scanStatusSchema, type ScanStatus } from '@contracts/ingest';
import { api } from '@/lib/api-client';
import { spectraKeys } from './keys';

export const getScanStatus = (campaignId: number, signal?: AbortSignal): Promise<ScanStatus> =>
  api.get(`/api/campaigns/${campaignId}/scan-status`, scanStatusSchema, signal);

export const getScanStatusQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: spectraKeys.scanStatus(campaignId), queryFn: ({ signal }) => getScanStatus(campaignId, signal) });

export const useScanStatus = (campaignId: number) => useQuery(getScanStatusQueryOptions(campaignId));

export const queueRescan = (campaignId: number) => api.post(`/api/campaigns/${campaignId}/rescans`, {}, rescanResponseSchema);

export function useQueueRescan(campaignId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => queueRescan(campaignId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: spectraKeys.scanStatus(campaignId) }),
  });
}
