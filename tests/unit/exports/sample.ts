import { DEFAULT_GRADE_SCHEME } from '../../../backend/src/contracts/grades';
import type { ConfirmedRow, ExportAssumptions } from '../../../backend/src/exports/types';

/** Planck 2018 VI abstract values (A&A 641, A6): H0 = 67.4, Ω_m = 0.315; reference-values.md §4. */
export const ASSUMPTIONS: ExportAssumptions = {
  campaign: 'Abell 2744 "arcs" & dropouts',
  wavelengths: 'vacuum',
  cosmology: { name: 'Planck18 (abstract)', h0: 67.4, omegaM: 0.315, omegaLambda: 0.685, flat: true },
  tolerance: 0.002,
  // Redward's default scheme: word codes named by the chance the redshift is right.
  gradeScheme: DEFAULT_GRADE_SCHEME,
  exportedAt: '2025-03-14T09:26:53.000Z',
  software: 'Redward 0.1.0 / redward-engine/0.2.0',
};

export function row(overrides: Partial<ConfirmedRow> = {}): ConfirmedRow {
  return {
    targetId: 'A2744-1021',
    spectrumId: 17,
    fileName: 'mask3_slit12.fits',
    ra: 3.5878125,
    dec: -30.3972778,
    z: 6.2,
    zErr: 0.0004,
    gradeCode: 'sure',
    gradeLabel: 'sure',
    spectrumClass: 'lyman-break',
    lines: ['Lya', 'NV'],
    photoZ: 6.05,
    photoZLow: 5.8,
    photoZHigh: 6.3,
    imageFamily: '5',
    readers: ['Ada Reader', 'Ben Second'],
    confirmedBy: 'agreement',
    confirmedAt: '2025-03-10T12:00:00.000Z',
    supersedes: null,
    interloperZ: 0.913,
    interloperDeltaChi2: 412.5,
    starDeltaChi2: 1830.25,
    id: 101,
    ...overrides,
  };
}

/** Three rows covering nulls, a star at z < 0, text needing quotes and escapes, and a correction. */
export const ROWS: ConfirmedRow[] = [
  row(),
  row({
    id: 102,
    targetId: null,
    spectrumId: 18,
    fileName: 'star, "cool" <M9>.txt',
    ra: null,
    dec: null,
    z: -0.0002,
    zErr: null,
    gradeCode: 'no-z',
    gradeLabel: 'no redshift',
    spectrumClass: 'star',
    lines: [],
    photoZ: null,
    photoZLow: null,
    photoZHigh: null,
    imageFamily: null,
    readers: ['Zoë Ångström'],
    confirmedBy: 'settlement',
    interloperZ: null,
    interloperDeltaChi2: null,
    starDeltaChi2: null,
  }),
  row({ id: 103, targetId: '#7 & <b>', spectrumId: 19, z: 1, zErr: 0.001, spectrumClass: 'galaxy', lines: ['[OII]3727', 'Hb', '[OIII]5007'], confirmedBy: 'correction', supersedes: 99, imageFamily: '5', interloperZ: null, interloperDeltaChi2: null, starDeltaChi2: null }),
];
