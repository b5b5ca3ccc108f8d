import { and, eq } from 'drizzle-orm';
import { gridStepOf, type GridStep } from '../contracts/campaigns';
import { assignments, jobItems, scanResults, spectra } from '../db/schema';
import type { ServiceContext } from '../services/context';
import { linkTarget, type LinkableTarget } from '../ingest/link-target';
import type { BlobStore } from '../storage/blob-store';
import { isSpectrumFileName, SPECTRUM_FILE_ENDINGS } from './accepted-files';
import { refreshProgress, type JobItemRow, type JobRow } from './job-store';
import type { ScanPool } from './scan-pool';
import type { ScanOutcome } from './scan-worker';

export interface JobSettings {
  zMin: number;
  zMax: number;
  /** Absent in jobs queued before campaigns had a grid setting: those scan on the default grid. */
  gridStep?: GridStep;
  /** Readers to assign each newly stored spectrum to, for the first and second reading. */
  assign?: { first?: number; second?: number };
}

export interface ItemContext {
  ctx: ServiceContext;
  store: BlobStore;
  pool: ScanPool;
  job: JobRow;
  settings: JobSettings;
  targets: () => readonly LinkableTarget[];
}

/**
 * Carries one item of an ingest or re-scan job to its end. Everything an item changes is
 * written in one transaction together with the item's own state, so a crash leaves it either
 * untouched (pending, redone on resume) or finished — never half-stored, never twice.
 */
export async function processItem(ic: ItemContext, item: JobItemRow): Promise<void> {
  const { ctx, job } = ic;
  if (job.kind === 'ingest') {
    const existing = findSpectrum(ic, item.sha256!);
    if (existing) return finishItem(ic, item, { state: 'done', outcome: 'duplicate', spectrumId: existing });
    if (!isSpectrumFileName(item.fileName)) {
      return finishItem(ic, item, {
        state: 'failed',
        errorCode: 'unsupported_type',
        errorMessage: `Not a spectrum file type Redward reads (${SPECTRUM_FILE_ENDINGS.join(', ')}). The file is kept in storage.`,
      });
    }
  }
  const { zMin, zMax } = ic.settings;
  const result = await ic.pool.run({ filePath: ic.store.pathOf(item.sha256!), fileName: item.fileName, zMin, zMax, gridStep: gridStepOf(ic.settings) });
  if (!result.ok) return finishItem(ic, item, { state: 'failed', errorCode: result.code, errorMessage: result.message });

  ctx.db.transaction((tx) => {
    let spectrumId: number;
    let outcome: 'stored' | 'duplicate' | 'rescanned';
    if (job.kind === 'ingest') {
      const meta = result.spectrum.meta;
      const link = linkTarget(ic.targets(), { fileName: item.fileName, objectName: meta.objectName, ra: meta.ra, dec: meta.dec }, ctx.config.linkToleranceArcsec);
      const inserted = tx
        .insert(spectra)
        .values({
          campaignId: job.campaignId,
          sha256: item.sha256!,
          fileName: item.fileName,
          targetId: link?.targetId ?? null,
          linkMethod: link?.method ?? null,
          objectName: meta.objectName ?? null,
          ra: meta.ra ?? null,
          dec: meta.dec ?? null,
          instrument: meta.instrument ?? null,
          exposureS: meta.exposureS ?? null,
          dateObs: meta.dateObs ?? null,
          fluxUnit: result.spectrum.fluxUnit,
          medium: meta.medium,
          pixels: result.spectrum.pixels,
          wavelengthMin: result.spectrum.wavelengthMin,
          wavelengthMax: result.spectrum.wavelengthMax,
          snrMedian: result.scanned.ok && Number.isFinite(result.scanned.scan.meta.snrMedian) ? result.scanned.scan.meta.snrMedian : null,
          errorsEstimated: meta.errorsEstimated,
          warnings: meta.warnings,
          uploadJobId: job.id,
        })
        .onConflictDoNothing()
        .returning({ id: spectra.id })
        .get();
      // The same content twice in one upload: the first copy to arrive is the spectrum.
      if (!inserted) {
        finishItemTx(tx, item, { state: 'done', outcome: 'duplicate', spectrumId: findSpectrumTx(tx, job.campaignId, item.sha256!) });
        return;
      }
      spectrumId = inserted.id;
      outcome = 'stored';
      for (const readingOrder of ['first', 'second'] as const) {
        const readerId = ic.settings.assign?.[readingOrder];
        if (readerId !== undefined) tx.insert(assignments).values({ spectrumId, readerId, readingOrder, assignedBy: job.createdBy }).run();
      }
    } else {
      spectrumId = item.spectrumId!;
      outcome = 'rescanned';
    }
    if (result.scanned.ok) {
      // A re-scan keeps the earlier result for the record; the new one becomes current.
      tx.update(scanResults).set({ isCurrent: false }).where(and(eq(scanResults.spectrumId, spectrumId), eq(scanResults.isCurrent, true))).run();
      insertScanResult(tx, spectrumId, job.id, ic.settings, result.scanned);
      finishItemTx(tx, item, { state: 'done', outcome, spectrumId });
    } else {
      // The spectrum is kept (it was read); the failed scan is listed so it can be redone.
      finishItemTx(tx, item, { state: 'failed', outcome, spectrumId, errorCode: result.scanned.code, errorMessage: result.scanned.message });
    }
  });
}

type Tx = Parameters<Parameters<ServiceContext['db']['transaction']>[0]>[0];

function insertScanResult(tx: Tx, spectrumId: number, jobId: number, settings: JobSettings, result: Extract<ScanOutcome, { ok: true }>) {
  const top = result.scan.solutions[0];
  tx.insert(scanResults)
    .values({
      spectrumId,
      jobId,
      engineVersion: result.scan.engineVersion,
      settings: { zMin: settings.zMin, zMax: settings.zMax, gridStep: gridStepOf(settings) },
      spectrumClass: result.scan.class,
      zBest: top?.z ?? null,
      zBestErr: top?.zErr ?? null,
      solutions: result.scan.solutions,
      lineMatches: result.scan.lineMatches,
      meta: { ...result.scan.meta, chi2Null: result.scan.chi2Null, ...(result.scan.unknownReason ? { unknownReason: result.scan.unknownReason } : {}) },
      curves: Buffer.from(result.curves),
      isCurrent: true,
    })
    .run();
}

function findSpectrum(ic: ItemContext, sha256: string): number | null {
  return findSpectrumTx(ic.ctx.db, ic.job.campaignId, sha256);
}

function findSpectrumTx(db: Pick<Tx, 'select'>, campaignId: number, sha256: string): number | null {
  return db.select({ id: spectra.id }).from(spectra).where(and(eq(spectra.campaignId, campaignId), eq(spectra.sha256, sha256))).get()?.id ?? null;
}

interface ItemEnd {
  state: 'done' | 'failed';
  outcome?: 'stored' | 'duplicate' | 'rescanned';
  spectrumId?: number | null;
  errorCode?: string;
  errorMessage?: string;
}

function finishItem(ic: ItemContext, item: JobItemRow, end: ItemEnd): void {
  ic.ctx.db.transaction((tx) => finishItemTx(tx, item, end));
}

function finishItemTx(tx: Tx, item: JobItemRow, end: ItemEnd): void {
  tx.update(jobItems)
    .set({
      state: end.state,
      outcome: end.outcome ?? null,
      spectrumId: end.spectrumId ?? item.spectrumId,
      errorCode: end.errorCode ?? null,
      errorMessage: end.errorMessage ?? null,
    })
    .where(and(eq(jobItems.id, item.id), eq(jobItems.state, 'pending')))
    .run();
  refreshProgress(tx, item.jobId);
}
