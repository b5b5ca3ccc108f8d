import type { SpectrumClass } from '@contracts/readings';

/**
 * Class names as readers say them, for the release pages (settlement, confirmed table). The
 * inspection and spectra features still hold their own older copies with the same wording.
 */
export const CLASS_NAMES: Record<SpectrumClass, string> = {
  galaxy: 'galaxy',
  quasar: 'quasar / AGN',
  star: 'star',
  'lyman-break': 'Lyman-break source',
  unknown: 'unknown',
};

export const CLASS_ORDER: SpectrumClass[] = ['galaxy', 'quasar', 'star', 'lyman-break', 'unknown'];

export const className = (c: string) => (c in CLASS_NAMES ? CLASS_NAMES[c as SpectrumClass] : c);
