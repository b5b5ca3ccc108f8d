import { readFileSync } from 'node:fs';
import type { MessagePort } from 'node:worker_threads';
import type { GridStep } from '../contracts/campaigns';
import { SpectrumReadError } from '../spectra/errors';
import { readSpectrum } from '../spectra/readSpectrum';
import { assertFiniteScan } from '../spectra/scanResultCheck';
import { scanSpectrum, type ScanResult, type Solution } from '../spectra/scanSpectrum';
import { solutionModel } from '../spectra/solutionModel';
import type { FluxUnit, SpectrumMeta } from '../spectra/types';
import { lowerThisThreadPriority } from './lower-thread-priority';
import { packCurves } from './scan-curves';

// Photo-z job items run on the same threads (jobs/photoz-job.ts).
export { runPhotoZTask } from './photoz-fit-task';

// Scans yield the core to the web thread whenever it has requests to answer (issue 13).
lowerThisThreadPriority();

/** Set by the pool: the worker posts on it once as it begins, which starts the task's time limit. */
interface Started {
  started?: MessagePort;
}

export interface ScanTask extends Started {
  /** The stored file to read (embedded queue), or … */
  filePath?: string;
  /** … its bytes, as a remote worker fetched them from the server (Redis queue). */
  bytes?: Uint8Array;
  fileName: string;
  zMin: number;
  zMax: number;
  gridStep: GridStep;
}

/** The engine's grid option for a campaign's grid setting: 'default' leaves the engine's own default. */
export function engineStep(gridStep: GridStep | undefined): { step?: 'native' } {
  return gridStep === 'native' ? { step: 'native' } : {};
}

export interface SpectrumSummary {
  meta: SpectrumMeta;
  fluxUnit: FluxUnit;
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
  task.started?.postMessage('started');
  let spectrum;
  try {
    spectrum = readSpectrum(task.bytes ?? readFileSync(task.filePath!));
  } catch (err) {
    if (err instanceof SpectrumReadError) return { ok: false, code: err.code, message: err.message };
    return { ok: false, code: 'unreadable', message: `The file could not be read: ${(err as Error).message}` };
  }
  const n = spectrum.wavelength.length;
  const summary = { meta: spectrum.meta, fluxUnit: spectrum.fluxUnit, pixels: n, wavelengthMin: spectrum.wavelength[0]!, wavelengthMax: spectrum.wavelength[n - 1]! };
  try {
    const { curves, ...scan } = assertFiniteScan(scanSpectrum(spectrum, { zMin: task.zMin, zMax: task.zMax, ...engineStep(task.gridStep) }));
    return { ok: true, spectrum: summary, scanned: { ok: true, scan, curves: packCurves(curves) } };
  } catch (err) {
    return {
      ok: true,
      spectrum: summary,
      scanned: { ok: false, code: 'scan_failed', message: `The spectrum was stored but its scan failed (${(err as Error).message}); re-scan it after an engine update.` },
    };
  }
}

export interface ModelTask extends Started {
  filePath: string;
  solution: Pick<Solution, 'z' | 'template'>;
  zMin?: number | undefined;
  zMax?: number | undefined;
  /** The grid the scan was made on: the model is rebuilt on the same one. */
  gridStep: GridStep;
}

export type ModelTaskResult = { ok: true; model: Float32Array } | { ok: false; message: string };

/**
 * Rebuilds the best-fit model of one solution on the spectrum's pixels. It re-runs part of a
 * scan, so it runs in a worker thread like the scans: the web server's thread stays free.
 */
export function runModelTask(task: ModelTask): ModelTaskResult {
  task.started?.postMessage('started');
  try {
    const spectrum = readSpectrum(readFileSync(task.filePath));
    return { ok: true, model: new Float32Array(solutionModel(spectrum, task.solution, { zMin: task.zMin, zMax: task.zMax, ...engineStep(task.gridStep) })) };
  } catch (err) {
    return { ok: false, message: (err as Error).message };
  }
}
