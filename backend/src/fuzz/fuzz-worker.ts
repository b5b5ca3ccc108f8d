import { SpectrumReadError } from '../spectra/errors';
import { readSpectrum } from '../spectra/readSpectrum';
import { nonFiniteInScan } from '../spectra/scanResultCheck';
import { scanSpectrum } from '../spectra/scanSpectrum';

export interface FuzzCase {
  bytes: Uint8Array;
}

export type FuzzCaseOutcome =
  | { kind: 'clean-error'; code: string }
  | { kind: 'success'; pixels: number; ignoredPixels: number }
  | { kind: 'non-finite'; problem: string }
  | { kind: 'crash'; error: string };

/**
 * Runs in a worker thread: reads the bytes and scans them as the scan worker does (default range
 * and grid). A SpectrumReadError is a clean refusal; any other exception is a crash; a finished scan
 * with a non-finite number in it is reported as such, before the guard that would refuse it.
 */
export default function runFuzzCase(task: FuzzCase): FuzzCaseOutcome {
  let spectrum;
  try {
    spectrum = readSpectrum(task.bytes);
  } catch (err) {
    if (err instanceof SpectrumReadError) return { kind: 'clean-error', code: err.code };
    return { kind: 'crash', error: describe(err) };
  }
  try {
    const result = scanSpectrum(spectrum);
    const problem = nonFiniteInScan(result);
    if (problem) return { kind: 'non-finite', problem };
    return { kind: 'success', pixels: spectrum.wavelength.length, ignoredPixels: spectrum.meta.ignoredPixels ?? 0 };
  } catch (err) {
    return { kind: 'crash', error: describe(err) };
  }
}

function describe(err: unknown): string {
  if (!(err instanceof Error)) return String(err);
  const where = err.stack?.split('\n').slice(1, 3).map((l) => l.trim()).join(' ← ') ?? '';
  return `${err.name}: ${err.message}${where ? ` (${where})` : ''}`;
}
