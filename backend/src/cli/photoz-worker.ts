import { fitCatalogue, type FitOptions, type PhotoZColumns } from '../photoz/fitPhotoZ';
import type { ModelGrid } from '../photoz/modelGrid';

/** One batch of sources for a worker thread; the grid's big arrays sit in SharedArrayBuffers. */
export interface PhotoZTask {
  grid: ModelGrid;
  flux: Float64Array;
  err: Float64Array;
  n: number;
  options?: Partial<FitOptions>;
}

/** Piscina entry point: fits one batch. */
export default function runPhotoZTask(task: PhotoZTask): PhotoZColumns {
  return fitCatalogue(task.grid, task.flux, task.err, task.n, task.options ?? {});
}
