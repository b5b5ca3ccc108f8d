export const memberKeys = {
  all: () => ['members'] as const,
  list: (campaignId: number) => [...memberKeys.all(), campaignId] as const,
};
