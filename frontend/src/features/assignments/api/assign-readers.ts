import { assignReadersResponseSchema } from '@contracts/release';
import type { z } from 'zod';
import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { assignmentKeys } from './keys';

export type AssignResult = z.infer<typeof assignReadersResponseSchema>;

export const assignReaders = (campaignId: number, readerIds: number[]): Promise<AssignResult> =>
  api.post(`/api/campaigns/${campaignId}/assignments`, { readerIds }, assignReadersResponseSchema);

/** `onAssigned` lets the page refresh what shows assignments (spectra list, queues), which other features own. */
export const useAssignReaders = (campaignId: number, onAssigned?: () => void) =>
  useMutation({
    mutationKey: assignmentKeys.assign(campaignId),
    mutationFn: (readerIds: number[]) => assignReaders(campaignId, readerIds),
    onSuccess: () => onAssigned?.(),
  });
