/** File name endings Redward reads as spectra (case-insensitive). */
export const SPECTRUM_FILE_ENDINGS = ['.fits', '.fit', '.fts', '.fits.gz', '.fit.gz', '.fts.gz', '.csv', '.tsv', '.txt', '.dat', '.ascii'] as const;

export function isSpectrumFileName(name: string): boolean {
  const lower = name.toLowerCase();
  return SPECTRUM_FILE_ENDINGS.some((ending) => lower.endsWith(ending));
}

export function isZipFileName(name: string): boolean {
  return name.toLowerCase().endsWith('.zip');
}
