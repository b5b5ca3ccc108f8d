import type { SpectraQuery } from '@contracts/ingest';

export const spectraKeys = {
  all: () => ['spectra'] as const,
  lists: (campaignId: number) => [...spectraKeys.all(), campaignId] as const,
  list: (campaignId: number, query: SpectraQuery) => [...spectraKeys.lists(campaignId), query] as const,
  scanStatus: (campaignId: number) => [...spectraKeys.all(), campaignId, 'scan-status'] as const,
};
