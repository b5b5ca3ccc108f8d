export const jobKeys = {
  all: () => ['jobs'] as const,
  detail: (jobId: number) => [...jobKeys.all(), jobId] as const,
  files: (jobId: number) => [...jobKeys.detail(jobId), 'files'] as const,
};
