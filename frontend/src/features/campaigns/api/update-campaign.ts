import { campaignResponseSchema } from '@contracts/campaigns';
import type { Campaign, UpdateCampaignRequest } from '@contracts/campaigns';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { campaignKeys } from './keys';

export async function updateCampaign(id: number, body: UpdateCampaignRequest): Promise<Campaign> {
  const { campaign } = await api.patch(`/api/campaigns/${id}`, body, campaignResponseSchema);
  return campaign;
}

export function useUpdateCampaign(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateCampaignRequest) => updateCampaign(id, body),
    onSuccess: (campaign) => {
      queryClient.setQueryData(campaignKeys.detail(id), campaign);
      return queryClient.invalidateQueries({ queryKey: campaignKeys.list() });
    },
  });
}
