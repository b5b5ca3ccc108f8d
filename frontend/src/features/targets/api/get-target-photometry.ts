import { targetPhotometrySchema } from '@contracts/targets';
import type { TargetPhotometry } from '@contracts/targets';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { targetKeys } from './keys';

export const getTargetPhotometry = (campaignId: number, targetId: number, signal?: AbortSignal): Promise<TargetPhotometry> =>
  api.get(`/api/campaigns/${campaignId}/targets/${targetId}/photometry`, targetPhotometrySchema, signal);

export const getTargetPhotometryQueryOptions = (campaignId: number, targetId: number) =>
  queryOptions({
    queryKey: targetKeys.photometry(campaignId, targetId),
    queryFn: ({ signal }) => getTargetPhotometry(campaignId, targetId, signal),
  });

export const useTargetPhotometry = (campaignId: number, targetId: number) => useQuery(getTargetPhotometryQueryOptions(campaignId, targetId));
