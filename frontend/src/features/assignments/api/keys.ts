/** Assignment has no list of its own to cache; the key names the mutation for devtools and tests. */
export const assignmentKeys = {
  all: () => ['assignments'] as const,
  assign: (campaignId: number) => [...assignmentKeys.all(), 'assign', campaignId] as const,
};
