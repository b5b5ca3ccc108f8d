import { campaignResponseSchema } from '@contracts/campaigns';
import type { Campaign, CreateCampaignRequest } from '@contracts/campaigns';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { campaignKeys } from './keys';

export async function createCampaign(body: CreateCampaignRequest): Promise<Campaign> {
  const { campaign } = await api.post('/api/campaigns', body, campaignResponseSchema);
  return campaign;
}

export function useCreateCampaign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCampaign,
    onSuccess: (campaign) => {
      queryClient.setQueryData(campaignKeys.detail(campaign.id), campaign);
      return queryClient.invalidateQueries({ queryKey: campaignKeys.list() });
    },
  });
}
