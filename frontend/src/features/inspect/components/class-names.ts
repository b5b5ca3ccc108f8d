import type { SpectrumClass } from '@contracts/readings';

/**
 * Class names as readers say them. The spectra feature has its own copy for its table; features
 * do not import each other, and the wording is short enough to keep in step by eye.
 */
export const CLASS_NAMES: Record<SpectrumClass, string> = {
  galaxy: 'galaxy',
  quasar: 'quasar / AGN',
  star: 'star',
  'lyman-break': 'Lyman-break source',
  unknown: 'unknown',
};

export const CLASS_ORDER: SpectrumClass[] = ['galaxy', 'quasar', 'star', 'lyman-break', 'unknown'];

export const asSpectrumClass = (c: string | null | undefined): SpectrumClass => (c && c in CLASS_NAMES ? (c as SpectrumClass) : 'unknown');
