import { membersResponseSchema } from '@contracts/campaigns';
import type { MembersResponse } from '@contracts/campaigns';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { memberKeys } from './keys';

export const getMembers = (campaignId: number, signal?: AbortSignal): Promise<MembersResponse> =>
  api.get(`/api/campaigns/${campaignId}/members`, membersResponseSchema, signal);

export const getMembersQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: memberKeys.list(campaignId), queryFn: ({ signal }) => getMembers(campaignId, signal) });

export const useMembers = (campaignId: number) => useQuery(getMembersQueryOptions(campaignId));
