/**
 * File endings the server reads as spectra, plus zip archives of them. The server is the
 * judge (it reports anything it cannot read); this list only keeps stray files of a chosen
 * folder (.DS_Store, notes, plots) out of the upload.
 */
const ENDINGS = ['.zip', '.fits', '.fit', '.fts', '.fits.gz', '.fit.gz', '.fts.gz', '.csv', '.tsv', '.txt', '.dat', '.ascii'];

export const ACCEPT_ATTRIBUTE = ENDINGS.filter((e) => !e.endsWith('.gz')).concat('.gz').join(',');

export const isAcceptedFile = (name: string) => {
  const lower = name.toLowerCase();
  return ENDINGS.some((ending) => lower.endsWith(ending));
};
