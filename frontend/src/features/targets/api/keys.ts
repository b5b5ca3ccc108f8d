export const targetKeys = {
  all: () => ['targets'] as const,
  lists: (campaignId: number) => [...targetKeys.all(), campaignId] as const,
  list: (campaignId: number, q: string) => [...targetKeys.lists(campaignId), { q }] as const,
  photometry: (campaignId: number, targetId: number) => [...targetKeys.lists(campaignId), 'photometry', targetId] as const,
  filters: (campaignId: number) => [...targetKeys.all(), 'filters', campaignId] as const,
};
