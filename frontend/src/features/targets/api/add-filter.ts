import { filterInfoSchema } from '@contracts/targets';
import type { FilterInfo } from '@contracts/targets';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sendForm } from '@/lib/send-form';
import { getFiltersQueryOptions } from './get-filters';

export interface FilterCurveInput {
  name: string;
  file: File;
}

/** Adds the campaign's own filter curve (two columns: Å, transmission); the server validates it line by line. */
export function addFilter(campaignId: number, { name, file }: FilterCurveInput): Promise<FilterInfo> {
  const form = new FormData();
  form.append('name', name);
  form.append('files', file, file.name);
  return sendForm(`/api/campaigns/${campaignId}/filters`, form, { schema: filterInfoSchema });
}

export function useAddFilter(campaignId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: FilterCurveInput) => addFilter(campaignId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getFiltersQueryOptions(campaignId).queryKey }),
  });
}
