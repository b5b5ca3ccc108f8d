import { disagreementSchema } from '@contracts/release';
import type { Disagreement } from '@contracts/release';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { disagreementKeys } from './keys';

const listSchema = z.array(disagreementSchema);

export const getDisagreements = (campaignId: number, signal?: AbortSignal): Promise<Disagreement[]> =>
  api.get(`/api/campaigns/${campaignId}/disagreements`, listSchema, signal);

export const getDisagreementsQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: disagreementKeys.list(campaignId), queryFn: ({ signal }) => getDisagreements(campaignId, signal) });

/** Leads only (the server answers 403 to others), so callers disable it for everyone else. */
export const useDisagreements = (campaignId: number, enabled = true) => useQuery({ ...getDisagreementsQueryOptions(campaignId), enabled });
