export const targetKeys = {
  all: () => ['targets'] as const,
  lists: (campaignId: number) => [...targetKeys.all(), campaignId] as const,
  list: (campaignId: number, q: string) => [...targetKeys.lists(campaignId), { q }] as const,
};
