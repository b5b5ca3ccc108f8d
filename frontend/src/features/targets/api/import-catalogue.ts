import { catalogueImportResultSchema } from '@contracts/targets';
import type { CatalogueImportResult, ColumnMapping } from '@contracts/targets';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';
import { sendForm } from '@/lib/send-form';
import { targetKeys } from './keys';

export interface CatalogueInput {
  file: File;
  /** Omitted on the first look, so the server proposes one from the column names. */
  mapping?: ColumnMapping;
}

function postCatalogue(campaignId: number, { file, mapping }: CatalogueInput, dryRun: boolean): Promise<CatalogueImportResult> {
  const form = new FormData();
  form.append('files', file, file.name);
  if (mapping) form.append('mapping', JSON.stringify(mapping));
  return sendForm(`/api/campaigns/${campaignId}/targets${dryRun ? '?dryRun=1' : ''}`, form, { schema: catalogueImportResultSchema });
}

/** Reads the catalogue without importing: columns, proposed mapping, row errors. */
export const checkCatalogue = (campaignId: number, input: CatalogueInput) => postCatalogue(campaignId, input, true);

/** Imports all rows or none; a refusal carries the row errors in `error.details`. */
export const importCatalogue = (campaignId: number, input: CatalogueInput) => postCatalogue(campaignId, input, false);

/** The row-by-row report of a refused import, when the error is one. */
export function refusedCatalogue(error: unknown): CatalogueImportResult | null {
  if (!isApiError(error) || error.code !== 'catalogue_invalid') return null;
  const parsed = catalogueImportResultSchema.safeParse(error.details);
  return parsed.success ? parsed.data : null;
}

export const useCheckCatalogue = (campaignId: number) =>
  useMutation({ mutationFn: (input: CatalogueInput) => checkCatalogue(campaignId, input) });

export function useImportCatalogue(campaignId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CatalogueInput) => importCatalogue(campaignId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: targetKeys.lists(campaignId) }),
  });
}
