import { targetPhotometrySchema } from '@contracts/targets';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { inspectKeys } from './keys';

export interface PhotoZPosterior {
  z: number[];
  p: number[];
}

/** The computed P(z) of a spectrum's target (null when it has no photometry). */
export async function getPhotoZPosterior(campaignId: number, targetId: number, signal?: AbortSignal): Promise<PhotoZPosterior | null> {
  const { posterior } = await api.get(`/api/campaigns/${campaignId}/targets/${targetId}/photometry`, targetPhotometrySchema, signal);
  return posterior;
}

export const getPhotoZPosteriorQueryOptions = (campaignId: number, targetId: number) =>
  queryOptions({
    queryKey: inspectKeys.photoZ(campaignId, targetId),
    queryFn: ({ signal }) => getPhotoZPosterior(campaignId, targetId, signal),
    // A fit changes only with a new catalogue import.
    staleTime: 5 * 60_000,
  });

/** Fetched only when the target has a computed photo-z. */
export const usePhotoZPosterior = (campaignId: number, targetId: number | null, hasFit: boolean) =>
  useQuery({ ...getPhotoZPosteriorQueryOptions(campaignId, targetId ?? 0), enabled: targetId !== null && hasFit });
