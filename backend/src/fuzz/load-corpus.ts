import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { isSpectrumFileName } from '../jobs/accepted-files';
import { readSpectrum } from '../spectra/readSpectrum';

/** Where the shared real spectra live, beside the project folder. */
export const REAL_SPECTRA_DIR = path.resolve(new URL('../../../../shared/real-spectra', import.meta.url).pathname);

/**
 * Real spectra to mutate: from each sub-folder of `dir`, the first `perFolder` spectrum files (by
 * name) that read cleanly as they are — a mutation of an unreadable file tells nothing.
 */
export function loadCorpus(dir: string, perFolder = 2): Array<{ name: string; bytes: Uint8Array }> {
  const corpus: Array<{ name: string; bytes: Uint8Array }> = [];
  for (const folder of readdirSync(dir).sort()) {
    const full = path.join(dir, folder);
    if (!statSync(full).isDirectory()) continue;
    let taken = 0;
    for (const file of readdirSync(full).sort()) {
      if (taken >= perFolder || !isSpectrumFileName(file)) continue;
      const bytes = new Uint8Array(readFileSync(path.join(full, file)));
      try {
        readSpectrum(bytes);
      } catch {
        continue;
      }
      corpus.push({ name: `${folder}/${file}`, bytes });
      taken++;
    }
  }
  return corpus;
}
