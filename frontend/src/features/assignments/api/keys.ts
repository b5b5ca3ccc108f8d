/** Keys for a spectrum's assignments and for the campaign-wide assignment mutation. */
export const assignmentKeys = {
  all: () => ['assignments'] as const,
  assign: (campaignId: number) => [...assignmentKeys.all(), 'assign', campaignId] as const,
  spectrum: (spectrumId: number) => [...assignmentKeys.all(), 'spectrum', spectrumId] as const,
};
