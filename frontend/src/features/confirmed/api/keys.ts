import type { ConfirmedFilters } from '../hooks/use-confirmed-query';

export const confirmedKeys = {
  all: () => ['confirmed'] as const,
  campaign: (campaignId: number) => [...confirmedKeys.all(), 'campaign', campaignId] as const,
  list: (campaignId: number, query: ConfirmedFilters) => [...confirmedKeys.campaign(campaignId), 'list', query] as const,
  families: (campaignId: number) => [...confirmedKeys.campaign(campaignId), 'families'] as const,
  statistics: (campaignId: number) => [...confirmedKeys.campaign(campaignId), 'statistics'] as const,
  history: (spectrumId: number) => [...confirmedKeys.all(), 'history', spectrumId] as const,
};
