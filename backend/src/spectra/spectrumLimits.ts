import { SpectrumReadError } from './errors';

/**
 * Shortest and longest wavelength a spectrum may carry, Å: 100 Å (extreme ultraviolet) to 1 mm
 * (10⁷ Å, where the far infrared ends). No spectrograph whose output Redward scans reaches past
 * either (common practice), and the bounds keep the log grid finite: 5 dex at most.
 */
export const MIN_WAVELENGTH_A = 100;
export const MAX_WAVELENGTH_A = 1e7;

/**
 * Refuses an axis with a non-finite, non-positive or absurd wavelength, naming the first such
 * row or pixel: one value like 1e308 would otherwise stretch the log grid over 300 dex, and a
 * denormal 1e-320 Å over 320 dex below, before the scan could even start.
 *
 * @param angstroms the axis in Å, as the reader converted it
 * @param written the axis as the file wrote it (same length), for the message; defaults to `angstroms`
 * @param where the part of the file ("Text table", "FITS HDU 1 binary table")
 * @param label names position i for a person ("line 512", "pixel 3")
 */
export function checkWavelengths(angstroms: ArrayLike<number>, where: string, label: (i: number) => string, written: ArrayLike<number> = angstroms): void {
  for (let i = 0; i < angstroms.length; i++) {
    const w = angstroms[i]!;
    if (w >= MIN_WAVELENGTH_A && w <= MAX_WAVELENGTH_A) continue;
    const asWritten = written[i]!;
    const shown = Object.is(asWritten, w) ? `${w} Å` : `${asWritten} (${w} Å)`;
    throw new SpectrumReadError(
      'bad-wavelength',
      `${where}, ${label(i)}: the wavelength ${shown} is ${Number.isNaN(w) ? 'not a number' : !Number.isFinite(w) ? 'infinite' : w <= 0 ? 'not positive' : `outside ${MIN_WAVELENGTH_A} Å – 1 mm`}; every wavelength must lie between ${MIN_WAVELENGTH_A} Å and 1 mm (10⁷ Å).`,
    );
  }
}

/**
 * Most pixels one spectrum may have. A 1D spectrum at R ≈ 10⁵ sampled three times per resolution
 * element across 3000 Å – 2.5 µm has ≈ 2 × 10⁶ (common practice: merged echelle spectra have
 * 10⁵–10⁶); beyond that a file is not a 1D spectrum, and reading and preparing it costs about
 * 150 bytes and 3 µs per pixel (10⁷ pixels measured: 1.5 GB, 28 s), so it is refused up front.
 */
export const MAX_PIXELS = 2_000_000;

/** Refuses a spectrum of more than `limit` (default MAX_PIXELS) pixels before its arrays are allocated. */
export function checkPixelCount(pixels: number, where: string, what = 'pixels', limit = MAX_PIXELS): void {
  if (pixels <= limit) return;
  throw new SpectrumReadError(
    'too-many-pixels',
    `${where}: ${pixels.toLocaleString('en-US')} ${what}; Redward scans 1D spectra of at most ${MAX_PIXELS.toLocaleString('en-US')} pixels.`,
  );
}
