/** Class names as readers say them; the API's keys stay in URLs and exports. */
export const CLASS_LABELS = {
  galaxy: 'galaxy',
  quasar: 'quasar / AGN',
  star: 'star',
  'lyman-break': 'Lyman-break source',
  unknown: 'unknown',
} as const;

export type SpectrumClass = keyof typeof CLASS_LABELS;

export const CLASS_TONES = { galaxy: 'ember', quasar: 'blue', star: 'ink', 'lyman-break': 'success', unknown: 'ink' } as const;

export const isSpectrumClass = (c: string | null): c is SpectrumClass => c !== null && c in CLASS_LABELS;
