export const disagreementKeys = {
  all: () => ['disagreements'] as const,
  list: (campaignId: number) => [...disagreementKeys.all(), 'list', campaignId] as const,
  solutions: (spectrumId: number) => [...disagreementKeys.all(), 'solutions', spectrumId] as const,
};
