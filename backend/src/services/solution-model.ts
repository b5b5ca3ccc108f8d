import { and, eq } from 'drizzle-orm';
import { scanResults, spectra } from '../db/schema';
import { AppError, notFound } from '../http/errors';
import { gridStepOf, type GridStep } from '../contracts/campaigns';
import type { Solution } from '../spectra/scanSpectrum';
import type { ServiceContext } from './context';

/**
 * The best-fit model of one solution of the current scan, on the spectrum's own pixels (float32,
 * NaN outside the fitted range), for drawing over the data. It is rebuilt from the stored file
 * with the scan's own settings, in a worker thread, so it shows exactly what the scan scored.
 */
export async function packSolutionModel(ctx: ServiceContext, spectrumId: number, rank: number, scanId?: number): Promise<Buffer> {
  const scan = ctx.db
    .select({ id: scanResults.id, solutions: scanResults.solutions, settings: scanResults.settings })
    .from(scanResults)
    .where(and(eq(scanResults.spectrumId, spectrumId), eq(scanResults.isCurrent, true)))
    .get();
  // The client names the scan it drew, so a model cached by the browser belongs to one scan only:
  // after a re-scan the old URL answers that it is gone instead of serving the new scan's model.
  if (scan && scanId !== undefined && scan.id !== scanId) {
    throw new AppError(409, 'scan_superseded', 'This spectrum has been re-scanned since the page was loaded; reload it to see the new solutions.');
  }
  const solution = scan ? (scan.solutions as Solution[])[rank - 1] : undefined;
  if (!scan || !solution) throw notFound(`This spectrum has no solution ${rank}.`, 'solution_not_found');
  const row = ctx.db.select({ sha256: spectra.sha256 }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
  const settings = scan.settings as { zMin?: number; zMax?: number; gridStep?: GridStep };
  const result = await ctx.scanPool.model({
    filePath: ctx.store.pathOf(row.sha256),
    solution: { z: solution.z, template: solution.template },
    zMin: settings.zMin,
    zMax: settings.zMax,
    gridStep: gridStepOf(settings),
  });
  // A scan made by an older engine may name a template this engine no longer has.
  if (!result.ok) throw new AppError(409, 'model_unavailable', `The model of this solution cannot be rebuilt (${result.message}); re-scan the spectrum.`);
  return Buffer.from(result.model.buffer, result.model.byteOffset, result.model.byteLength);
}
