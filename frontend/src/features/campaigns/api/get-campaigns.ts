import { campaignListResponseSchema } from '@contracts/campaigns';
import type { CampaignListItem } from '@contracts/campaigns';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { campaignKeys } from './keys';

export async function getCampaigns(signal?: AbortSignal): Promise<CampaignListItem[]> {
  const { campaigns } = await api.get('/api/campaigns', campaignListResponseSchema, signal);
  return campaigns;
}

export const getCampaignsQueryOptions = () =>
  queryOptions({ queryKey: campaignKeys.list(), queryFn: ({ signal }) => getCampaigns(signal) });

export const useCampaigns = () => useQuery(getCampaignsQueryOptions());
