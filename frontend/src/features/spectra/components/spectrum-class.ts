import type { SpectrumClass } from '@contracts/readings';
import { CLASS_NAMES } from '@/lib/spectrum-class';

export { isSpectrumClass } from '@/lib/spectrum-class';
export type { SpectrumClass };

export const CLASS_LABELS = CLASS_NAMES;

export const CLASS_TONES: Record<SpectrumClass, 'ember' | 'blue' | 'ink' | 'success'> = { galaxy: 'ember', quasar: 'blue', star: 'ink', 'lyman-break': 'success', unknown: 'ink' };

