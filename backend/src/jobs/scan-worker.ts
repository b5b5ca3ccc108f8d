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

export type ScanTaskResult =
  | { ok: true; spectrum: SpectrumSummary; scan: Omit<ScanResult, 'curves'>; curves: Uint8Array }
  | { ok: false; stage: 'read' | 'scan'; code: string; message: string };

/**
 * Runs in a worker thread: reads one stored file, scans it, and returns what the database
 * keeps. Reading errors are answers, not failures: they are reported per file.
 */
export default function runScanTask(task: ScanTask): ScanTaskResult {
  let spectrum;
  try {
    spectrum = readSpectrum(readFileSync(task.filePath));
  } catch (err) {
    if (err instanceof SpectrumReadError) return { ok: false, stage: 'read', code: err.code, message: err.message };
    return { ok: false, stage: 'read', code: 'unreadable', message: `The file could not be read: ${(err as Error).message}` };
  }
  try {
    const { curves, ...scan } = scanSpectrum(spectrum, { zMin: task.zMin, zMax: task.zMax });
    const n = spectrum.wavelength.length;
    return {
      ok: true,
      spectrum: { meta: spectrum.meta, pixels: n, wavelengthMin: spectrum.wavelength[0]!, wavelengthMax: spectrum.wavelength[n - 1]! },
      scan,
      curves: packCurves(curves),
    };
  } catch (err) {
    return { ok: false, stage: 'scan', code: 'scan_failed', message: `The spectrum was read but the scan failed: ${(err as Error).message}` };
  }
}
