import { queryOptions, useQuery } from '@tanstack/react-query';
import { campaignStatisticsSchema, type CampaignStatistics } from '@contracts/release';
import { api } from '@/lib/api-client';
import { confirmedKeys } from './keys';

export const getStatistics = (campaignId: number, signal?: AbortSignal): Promise<CampaignStatistics> =>
  api.get(`/api/campaigns/${campaignId}/statistics`, campaignStatisticsSchema, signal);

export const getStatisticsQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: confirmedKeys.statistics(campaignId), queryFn: ({ signal }) => getStatistics(campaignId, signal) });

export const useStatistics = (campaignId: number) => useQuery(getStatisticsQueryOptions(campaignId));
