import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { confirmedKeys } from './keys';

/* Mirrors FamilyCheck in backend/src/exports/familyTable.ts (no contract schema yet). */
const familySchema = z.object({
  family: z.string(),
  members: z.array(z.object({ targetId: z.string().nullable(), spectrumId: z.number().int(), recordId: z.number().int(), z: z.number(), gradeCode: z.number().int(), gradeLabel: z.string() })),
  unconfirmed: z.array(z.object({ targetId: z.string().nullable(), spectrumId: z.number().int().nullable() })),
  meanZ: z.number().nullable(),
  spread: z.number().nullable(),
  discrepant: z.boolean(),
  incomplete: z.boolean(),
  flagged: z.boolean(),
});
export type FamilyCheck = z.infer<typeof familySchema>;
const familiesSchema = z.object({ families: z.array(familySchema), tolerance: z.number() });
export type FamiliesAnswer = z.infer<typeof familiesSchema>;

export const getFamilies = (campaignId: number, signal?: AbortSignal): Promise<FamiliesAnswer> =>
  api.get(`/api/campaigns/${campaignId}/families?format=json`, familiesSchema, signal);

export const getFamiliesQueryOptions = (campaignId: number) =>
  queryOptions({ queryKey: confirmedKeys.families(campaignId), queryFn: ({ signal }) => getFamilies(campaignId, signal) });

export const useFamilies = (campaignId: number) => useQuery(getFamiliesQueryOptions(campaignId));
