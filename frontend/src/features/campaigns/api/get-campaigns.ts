import { campaignListResponseSchema } from '@contracts/campaigns';
import type { Campaign } from '@contracts/campaigns';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { campaignKeys } from './keys';

export async function getCampaigns(signal?: AbortSignal): Promise<Campaign[]> {
  const { campaigns } = await api.get('/api/campaigns', campaignListResponseSchema, signal);
  return campaigns;
}

export const getCampaignsQueryOptions = () =>
  queryOptions({ queryKey: campaignKeys.list(), queryFn: ({ signal }) => getCampaigns(signal) });

export const useCampaigns = () => useQuery(getCampaignsQueryOptions());
