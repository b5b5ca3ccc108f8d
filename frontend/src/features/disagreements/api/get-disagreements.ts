import { disagreementListSchema } from '@contracts/release';
import type { Disagreement } from '@contracts/release';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { disagreementKeys } from './keys';

export const getDisagreements = (campaignId: number, signal?: AbortSignal): Promise<Disagreement[]> =>
  api.get(`/api/campaigns/${campaignId}/disagreements`, disagreementListSchema, signal);

export const getDisagreementsQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: disagreementKeys.list(campaignId), queryFn: ({ signal }) => getDisagreements(campaignId, signal) });

/** Leads only (the server answers 403 to others), so callers disable it for everyone else. */
export const useDisagreements = (campaignId: number, enabled = true) => useQuery({ ...getDisagreementsQueryOptions(campaignId), enabled });
