import type { SpectrumClass } from '@contracts/readings';

/** Class names as readers say them; the API's keys stay in URLs and exports. One list for every page. */
export const CLASS_NAMES: Record<SpectrumClass, string> = {
  galaxy: 'galaxy',
  quasar: 'quasar / AGN',
  star: 'star',
  'lyman-break': 'Lyman-break source',
  unknown: 'unknown',
};

export const CLASS_ORDER: SpectrumClass[] = ['galaxy', 'quasar', 'star', 'lyman-break', 'unknown'];

export const isSpectrumClass = (c: string | null | undefined): c is SpectrumClass => typeof c === 'string' && c in CLASS_NAMES;

export const asSpectrumClass = (c: string | null | undefined): SpectrumClass => (isSpectrumClass(c) ? c : 'unknown');

export const className = (c: string) => (isSpectrumClass(c) ? CLASS_NAMES[c] : c);
