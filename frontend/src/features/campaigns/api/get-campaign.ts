import { campaignResponseSchema } from '@contracts/campaigns';
import type { Campaign } from '@contracts/campaigns';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { campaignKeys } from './keys';

export async function getCampaign(id: number, signal?: AbortSignal): Promise<Campaign> {
  const { campaign } = await api.get(`/api/campaigns/${id}`, campaignResponseSchema, signal);
  return campaign;
}

export const getCampaignQueryOptions = (id: number) =>
  queryOptions({ queryKey: campaignKeys.detail(id), queryFn: ({ signal }) => getCampaign(id, signal) });

export const useCampaign = (id: number) => useQuery(getCampaignQueryOptions(id));
