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
    // More digits than its error supports: the exports write 6.2 (z_err 0.00040 → 5 decimals).
    z: 6.200001234567,
    zErr: 0.0004,
    gradeCode: 'sure',
    gradeLabel: 'sure',
    spectrumClass: 'lyman-break',
    lines: ['Ly-alpha', 'N V 1239'],
    lineMeasurements: [
      { name: 'Ly-alpha', measure: 'flux', value: 3.21e-17, error: 2.4e-18, snr: 13.4, offsetKms: 212.4, detected: true, blendedWith: [] },
      { name: 'N V 1239', measure: 'flux', value: 2.1e-18, error: 1.5e-18, snr: 1.4, offsetKms: null, detected: false, blendedWith: [] },
    ],
    lineFluxUnit: 'erg s⁻¹ cm⁻²',
    zErrFloor: 0.00039,
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
    lineMeasurements: [],
    lineFluxUnit: null,
    zErrFloor: null,
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
  row({
    id: 103,
    targetId: '#7 & <b>',
    spectrumId: 19,
    z: 1,
    zErr: 0.001,
    spectrumClass: 'galaxy',
    lines: ['[O II] 3727', '[O II] 3730', 'H-beta', '4000 Å break'],
    lineMeasurements: [
      { name: '[O II] 3727', measure: 'flux', value: 4.5e-17, error: 5e-18, snr: 9, offsetKms: -20.4, detected: true, blendedWith: ['[O II] 3730'] },
      { name: '[O II] 3730', measure: 'flux', value: 4.5e-17, error: 5e-18, snr: 9, offsetKms: -20.4, detected: true, blendedWith: ['[O II] 3727'] },
      { name: '4000 Å break', measure: 'break', value: 1.42, error: 0.05, snr: 8.1, offsetKms: null, detected: true, blendedWith: [] },
    ],
    zErrFloor: 0.00085,
    confirmedBy: 'correction',
    supersedes: 99,
    imageFamily: '5',
    interloperZ: null,
    interloperDeltaChi2: null,
    starDeltaChi2: null,
  }),
];

/**
 * What the exports must write for ROWS, worked out by hand: z to the decimal of the second
 * significant digit of z_err (z_err rounded up), the lines with their measurements, the Lyα caveat.
 */
export const EXPECTED = [
  {
    z: 6.2,
    zErr: 0.0004,
    linesMeasured: 'Ly-alpha:flux=3.21e-17+/-2.4e-18:sn=13.4:dv=212;N V 1239:flux=2.1e-18+/-1.5e-18:sn=1.4:below-3sigma',
    lineFluxUnit: 'erg s-1 cm-2',
    caveat: 'z rests on Lya alone: Lya emission is typically offset redward of systemic by a few hundred km/s (Shapley et al. 2003, from memory)',
  },
  { z: -0.0002, zErr: null, linesMeasured: null, lineFluxUnit: null, caveat: null },
  {
    z: 1,
    zErr: 0.001,
    linesMeasured: '[O II] 3727+[O II] 3730:flux=4.5e-17+/-5e-18:sn=9.0:dv=-20;4000 Å break:ratio=1.42+/-0.05:sn=8.1',
    lineFluxUnit: 'erg s-1 cm-2',
    caveat: null,
  },
] as const;
