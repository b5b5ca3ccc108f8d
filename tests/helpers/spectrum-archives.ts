import { strToU8, zipSync } from 'fflate';
import { spectrumToCsv } from '../../backend/src/demo/spectrum-files';
import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import type { TemplateClass } from '../../backend/src/spectra/types';

const CLASSES: TemplateClass[] = ['galaxy', 'quasar', 'galaxy', 'lyman-break'];

/** `count` seeded synthetic spectra as CSV files, named after invented catalogue ids. */
export function syntheticSpectrumFiles(count: number, options: { pixels?: number; prefix?: string } = {}): Record<string, Uint8Array> {
  const files: Record<string, Uint8Array> = {};
  for (let i = 0; i < count; i++) {
    const cls = CLASSES[i % CLASSES.length]!;
    const z = cls === 'lyman-break' ? 5 + (i % 30) * 0.1 : cls === 'quasar' ? 1 + (i % 20) * 0.1 : 0.2 + (i % 40) * 0.03;
    const spectrum = generateSyntheticSpectrum({ class: cls, z, snr: 8, seed: 1000 + i, pixels: options.pixels ?? 2000 });
    const id = `${options.prefix ?? 'TST'}-${String(i + 1).padStart(4, '0')}`;
    files[`night1/${id}.csv`] = strToU8(spectrumToCsv(spectrum, `synthetic ${cls} at z=${z.toFixed(3)}`));
  }
  return files;
}

/** The three broken files of the ingest acceptance test. */
export function brokenSpectrumFiles(): Record<string, Uint8Array> {
  // A FITS primary header announcing a 4000-pixel float32 image, cut off after the header.
  const cards = ['SIMPLE  =                    T', 'BITPIX  =                  -32', 'NAXIS   =                    1', 'NAXIS1  =                 4000', 'CRVAL1  =               3600.0', 'CDELT1  =                  1.5', 'END'];
  const header = cards.map((c) => c.padEnd(80, ' ')).join('').padEnd(2880, ' ');
  const truncated = new Uint8Array(2880 + 1000);
  truncated.set(strToU8(header));
  return {
    'broken/truncated.fits': truncated,
    'broken/no-flux-column.csv': strToU8('wavelength,sky\n' + Array.from({ length: 50 }, (_, i) => `${4000 + i},${i % 7}`).join('\n') + '\n'),
    'broken/empty.txt': new Uint8Array(0),
  };
}

export function zip(files: Record<string, Uint8Array>): Buffer {
  return Buffer.from(zipSync(files, { level: 6 }));
}
