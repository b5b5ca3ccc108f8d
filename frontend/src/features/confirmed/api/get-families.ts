import { familiesResponseSchema } from '@contracts/release';
import type { FamiliesResponse } from '@contracts/release';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { confirmedKeys } from './keys';

export type { FamilyCheck } from '@contracts/release';
export type FamiliesAnswer = FamiliesResponse;

export const getFamilies = (campaignId: number, signal?: AbortSignal): Promise<FamiliesAnswer> =>
  api.get(`/api/campaigns/${campaignId}/families?format=json`, familiesResponseSchema, signal);

export const getFamiliesQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: confirmedKeys.families(campaignId), queryFn: ({ signal }) => getFamilies(campaignId, signal) });

export const useFamilies = (campaignId: number) => useQuery(getFamiliesQueryOptions(campaignId));
