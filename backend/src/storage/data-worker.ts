import { readFileSync } from 'node:fs';
import { move } from 'piscina';
import { SpectrumReadError } from '../spectra/errors';
import { readSpectrum } from '../spectra/readSpectrum';
import { packSpectrum } from './pack-spectrum';

/**
 * Runs in the spectrum-data thread (data-thread.ts): reads a stored file, parses it with the
 * ordinary readers and packs the arrays the `/data` route sends. Readers are waiting for this
 * answer, so unlike the scan and store threads it keeps its normal priority.
 */
export type DataTask = { kind: 'warm' } | { kind: 'pack'; filePath: string };

/**
 * The packed bytes, or the refusal of a file the readers cannot read (an answer, not a failure: an
 * error's class does not cross threads). The bytes are the whole answer because piscina hands a
 * moved buffer over only when it is the task's value itself, not a field of it.
 */
export type DataTaskResult = Uint8Array | { code: SpectrumReadError['code']; message: string };

export default function runDataTask(task: DataTask): DataTaskResult | 'warm' {
  if (task.kind === 'warm') {
    warmTextReader();
    return 'warm';
  }
  let packed: Buffer;
  try {
    packed = packSpectrum(readSpectrum(readFileSync(task.filePath)));
  } catch (err) {
    if (err instanceof SpectrumReadError) return { code: err.code, message: err.message };
    throw err;
  }
  // Handed over, not copied: the packing is the whole answer and the thread keeps no use for it.
  return move(packed) as Uint8Array;
}

/**
 * The readers are loaded with this module; what is left cold is V8's code for them. Unoptimised,
 * the first stored text tables took 25–85 ms each to parse on this thread against 5–15 ms once
 * warm (bench:load, first second, 116 kB CSV files), and the first readers queued behind them.
 * So the thread parses a made-up 4,000-row table a few times before the server listens. Text only:
 * it is the slow reader (FITS arrays are read as binary).
 */
function warmTextReader(): void {
  const rows = ['# a made-up table to warm the reader', '# medium: vacuum', 'wavelength_angstrom,flux,error,mask'];
  for (let i = 0; i < 4000; i++) {
    const wavelength = 3600 + i * 1.55;
    const line = Math.exp(-(((wavelength - 6563) / 4) ** 2));
    rows.push(`${wavelength.toFixed(3)},${(1 + 0.0001 * i + 3 * line).toPrecision(6)},${(0.1).toPrecision(5)},0`);
  }
  const table = new TextEncoder().encode(rows.join('\n') + '\n');
  for (let round = 0; round < 8; round++) packSpectrum(readSpectrum(table));
}
