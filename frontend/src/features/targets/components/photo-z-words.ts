import type { PhotoZSummary } from '@contracts/targets';

/** How the targets table groups computed photo-z for filtering (our own thresholds, stated in the UI). */
export const PHOTO_Z_KINDS = {
  all: 'All targets',
  dropout: 'Dropout candidates (z ≥ 3, P(z < 2) < 10 %)',
  interloper: 'Likely low-z interlopers (P(z < 2) ≥ 50 %)',
  star: 'Star-like (a star fits better than any galaxy)',
  none: 'No photometry',
} as const;
export type PhotoZKind = keyof typeof PHOTO_Z_KINDS;

export function photoZKindMatches(fit: PhotoZSummary | null, kind: PhotoZKind): boolean {
  switch (kind) {
    case 'all':
      return true;
    case 'none':
      return fit === null;
    case 'star':
      return fit?.class === 'star';
    case 'dropout':
      return fit !== null && fit.class === 'galaxy' && fit.z >= 3 && fit.pLowZ < 0.1;
    case 'interloper':
      return fit !== null && fit.class === 'galaxy' && fit.pLowZ >= 0.5;
  }
}

export const formatPercent = (p: number) => (p < 0.001 ? '< 0.1 %' : p > 0.999 ? '> 99.9 %' : `${(100 * p).toFixed(p < 0.1 ? 1 : 0)} %`);

export const formatInterval = ([lo, hi]: [number, number]) => `${lo.toFixed(2)}–${hi.toFixed(2)}`;
