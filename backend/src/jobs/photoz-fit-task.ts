import type { MessagePort } from 'node:worker_threads';
import type { FilterCurve } from '../photoz/filterCurve';
import { fitSources, type SourceFit } from '../services/photo-z-grid';

/** One item of a photo-z job, fitted on a scan-pool thread (the model grid is cached per thread). */
export interface PhotoZTask {
  curves: FilterCurve[];
  /** Row-major fluxes and errors, nJy, curves.length bands per source. */
  flux: Float64Array;
  err: Float64Array;
  /** Set by the pool: posted once as the task begins (starts its time limit). */
  started?: MessagePort;
}

export type PhotoZTaskResult = { ok: true; fits: SourceFit[] } | { ok: false; message: string };

export function runPhotoZTask(task: PhotoZTask): PhotoZTaskResult {
  task.started?.postMessage('started');
  return { ok: true, fits: fitSources(task.curves, task.flux, task.err) };
}
