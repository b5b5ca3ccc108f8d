import { SPEED_OF_LIGHT_KMS } from '@/components/spectrum/velocity';

/** The features readers judge up close, each a group of rest wavelengths (vacuum Å) seen in one panel. */
export interface FeatureWindow {
  id: string;
  title: string;
  /** The rest wavelength velocity zero refers to. */
  anchor: number;
  /** Expected positions marked in the panel. */
  marks: Array<{ label: string; rest: number }>;
}

export const FEATURE_WINDOWS: FeatureWindow[] = [
  { id: 'lya', title: 'Lyα', anchor: 1215.67, marks: [{ label: 'Lyα', rest: 1215.67 }] },
  { id: 'civ', title: 'C IV 1548/1551', anchor: 1549.48, marks: [{ label: '1548', rest: 1548.187 }, { label: '1551', rest: 1550.772 }] },
  { id: 'mgii', title: 'Mg II 2796/2804', anchor: 2799.94, marks: [{ label: '2796', rest: 2796.352 }, { label: '2804', rest: 2803.531 }] },
  { id: 'oii', title: '[O II] 3727/3730', anchor: 3728.48, marks: [{ label: '3727', rest: 3727.092 }, { label: '3730', rest: 3729.875 }] },
  { id: 'cahk', title: 'Ca H&K', anchor: 3952.18, marks: [{ label: 'K', rest: 3934.777 }, { label: 'H', rest: 3969.591 }] },
  {
    id: 'hb-oiii',
    title: 'Hβ + [O III]',
    anchor: 4960.295,
    marks: [
      { label: 'Hβ', rest: 4862.68 },
      { label: '4960', rest: 4960.295 },
      { label: '5008', rest: 5008.24 },
    ],
  },
  {
    id: 'ha-nii',
    title: 'Hα + [N II]',
    anchor: 6564.607,
    marks: [
      { label: '6550', rest: 6549.861 },
      { label: 'Hα', rest: 6564.607 },
      { label: '6585', rest: 6585.273 },
    ],
  },
];


/**
 * Observed wavelength span of a window at z: ±halfWidth km/s beyond its outermost marks, so a
 * group such as Hβ + [O III] is seen whole.
 */
export function windowSpan(w: FeatureWindow, z: number, halfWidthKms: number): [number, number] {
  const f = halfWidthKms / SPEED_OF_LIGHT_KMS;
  const rests = w.marks.map((m) => m.rest);
  return [Math.min(...rests) * (1 + z) * (1 - f), Math.max(...rests) * (1 + z) * (1 + f)];
}

/** Velocity (km/s) of an observed wavelength relative to the window's anchor at z. */
export const velocityOf = (lambda: number, anchor: number, z: number) => SPEED_OF_LIGHT_KMS * (lambda / (anchor * (1 + z)) - 1);
