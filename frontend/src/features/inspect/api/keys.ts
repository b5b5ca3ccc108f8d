export const inspectKeys = {
  all: () => ['inspect'] as const,
  queues: () => [...inspectKeys.all(), 'queue'] as const,
  queue: (campaignId: number) => [...inspectKeys.queues(), campaignId] as const,
  spectrum: (spectrumId: number) => [...inspectKeys.all(), 'spectrum', spectrumId] as const,
  detail: (spectrumId: number) => [...inspectKeys.spectrum(spectrumId), 'detail'] as const,
  curves: (spectrumId: number) => [...inspectKeys.spectrum(spectrumId), 'curves'] as const,
  lines: (spectrumId: number, z: number, cls: string) => [...inspectKeys.spectrum(spectrumId), 'lines', z, cls] as const,
  /** A target's computed P(z), drawn on the χ² strip. */
  photoZ: (campaignId: number, targetId: number) => [...inspectKeys.all(), 'photo-z', campaignId, targetId] as const,
  model: (spectrumId: number, scanId: number, rank: number) => [...inspectKeys.spectrum(spectrumId), 'model', scanId, rank] as const,
};
