import { readFileSync } from 'node:fs';
import { SpectrumReadError } from '../spectra/errors';
import { readSpectrum } from '../spectra/readSpectrum';
import { scanSpectrum, type ScanResult } from '../spectra/scanSpectrum';
import type { SpectrumMeta } from '../spectra/types';
import { packCurves } from './scan-curves';

export interface ScanTask {
  filePath: string;
  fileName: string;
  zMin: number;
  zMax: number;
}

export interface SpectrumSummary {
  meta: SpectrumMeta;
  pixels: number;
  wavelengthMin: number;
  wavelengthMax: number;
}

export type ScanOutcome =
  | { ok: true; scan: Omit<ScanResult, 'curves'>; curves: Uint8Array }
  | { ok: false; code: 'scan_failed'; message: string };

/** A readable file always yields its spectrum summary; the scan may still fail (an engine fault). */
export type ScanTaskResult =
  | { ok: true; spectrum: SpectrumSummary; scanned: ScanOutcome }
  | { ok: false; code: string; message: string };

/**
 * Runs in a worker thread: reads one stored file, scans it, and returns what the database
 * keeps. Reading errors are answers, not failures: they are reported per file.
 */
export default function runScanTask(task: ScanTask): ScanTaskResult {
  let spectrum;
  try {
    spectrum = readSpectrum(readFileSync(task.filePath));
  } catch (err) {
    if (err instanceof SpectrumReadError) return { ok: false, code: err.code, message: err.message };
    return { ok: false, code: 'unreadable', message: `The file could not be read: ${(err as Error).message}` };
  }
  const n = spectrum.wavelength.length;
  const summary = { meta: spectrum.meta, pixels: n, wavelengthMin: spectrum.wavelength[0]!, wavelengthMax: spectrum.wavelength[n - 1]! };
  try {
    const { curves, ...scan } = scanSpectrum(spectrum, { zMin: task.zMin, zMax: task.zMax });
    return { ok: true, spectrum: summary, scanned: { ok: true, scan, curves: packCurves(curves) } };
  } catch (err) {
    return {
      ok: true,
      spectrum: summary,
      scanned: { ok: false, code: 'scan_failed', message: `The spectrum was stored but its scan failed (${(err as Error).message}); re-scan it after an engine update.` },
    };
  }
}
