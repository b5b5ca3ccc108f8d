import { gridStepOf, type GridStep } from '../contracts/campaigns';
import type { ServiceContext } from '../services/context';
import { linkTarget, type LinkableTarget } from '../ingest/link-target';
import type { BlobStore } from '../storage/blob-store';
import { isSpectrumFileName, SPECTRUM_FILE_ENDINGS } from './accepted-files';
import type { JobItemRow, JobRow } from './job-store';
import { countItemDone, finishPendingItem, insertAssignment, insertScanResult, insertSpectrum, itemState, retireCurrentScan, spectrumByContent } from './result-statements';
import type { ScanPool } from './scan-pool';
import type { ScanOutcome, ScanTaskResult } from './scan-worker';

export interface JobSettings {
  zMin: number;
  zMax: number;
  /** Absent in jobs queued before campaigns had a grid setting: those scan on the default grid. */
  gridStep?: GridStep;
  /** Readers to assign each newly stored spectrum to, for the first and second reading. */
  assign?: { first?: number; second?: number };
}

/** What recording an item's result needs: no scan pool, no files (a remote worker did the scan). */
export interface ResultContext {
  ctx: ServiceContext;
  job: JobRow;
  settings: JobSettings;
  targets: () => readonly LinkableTarget[];
}

export interface ItemContext extends ResultContext {
  store: BlobStore;
  pool: ScanPool;
}

/**
 * Carries one item of an ingest or re-scan job to its end on this machine's scan pool (the
 * embedded queue). Everything an item changes is written in one transaction together with the
 * item's own state, so a crash leaves it either untouched (pending, redone on resume) or
 * finished — never half-stored, never twice. `record` writes the result (the job runner passes
 * its ResultBatch, which writes several to a transaction; the default writes this one alone).
 */
export async function processItem(ic: ItemContext, item: JobItemRow, record: (item: JobItemRow, result: ScanTaskResult) => void = (i, r) => recordItemResult(ic, i, r)): Promise<void> {
  if (finishWithoutScan(ic, item)) return;
  const result = await ic.pool.run({ filePath: ic.store.pathOf(item.sha256!), ...scanSettingsOf(ic.settings), fileName: item.fileName });
  record(item, result);
}

/** The engine settings an item is scanned with (the job's, fixed when it was queued). */
export function scanSettingsOf(settings: JobSettings): { zMin: number; zMax: number; gridStep: GridStep } {
  return { zMin: settings.zMin, zMax: settings.zMax, gridStep: gridStepOf(settings) };
}

/**
 * Finishes the items that need no scan: a file already in the campaign (a duplicate) or one that
 * is no spectrum file. True when the item is finished.
 */
export function finishWithoutScan(ic: ResultContext, item: JobItemRow): boolean {
  if (ic.job.kind !== 'ingest') return false;
  const existing = findSpectrum(ic, item.sha256!);
  if (existing) {
    finishItem(ic, item, { state: 'done', outcome: 'duplicate', spectrumId: existing });
    return true;
  }
  if (!isSpectrumFileName(item.fileName)) {
    finishItem(ic, item, {
      state: 'failed',
      errorCode: 'unsupported_type',
      errorMessage: `Not a spectrum file type Redward reads (${SPECTRUM_FILE_ENDINGS.join(', ')}). The file is kept in storage.`,
    });
    return true;
  }
  return false;
}

/**
 * Records what the scan of one item found, wherever it ran. Idempotent by item: once the item
 * is finished (by this call, an earlier one, or another runner), a repeat changes nothing — no
 * second spectrum, no second current scan. Returns whether this call finished the item.
 */
export function recordItemResult(ic: ResultContext, item: JobItemRow, result: ScanTaskResult): boolean {
  const { ctx, job } = ic;
  if (!result.ok) return finishItem(ic, item, { state: 'failed', errorCode: result.code, errorMessage: result.message });

  const { db } = ctx;
  return db.transaction(() => {
    if (itemState(db).get({ itemId: item.id })?.state !== 'pending') return false;
    let spectrumId: number;
    let outcome: 'stored' | 'duplicate' | 'rescanned';
    if (job.kind === 'ingest') {
      const meta = result.spectrum.meta;
      const link = linkTarget(ic.targets(), { fileName: item.fileName, objectName: meta.objectName, ra: meta.ra, dec: meta.dec }, ctx.config.linkToleranceArcsec);
      const inserted = insertSpectrum(db).get({
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
      });
      // The same content twice in one upload: the first copy to arrive is the spectrum.
      if (!inserted) return finishItemTx(ic, item, { state: 'done', outcome: 'duplicate', spectrumId: findSpectrum(ic, item.sha256!) });
      spectrumId = inserted.id;
      outcome = 'stored';
      for (const readingOrder of ['first', 'second'] as const) {
        const readerId = ic.settings.assign?.[readingOrder];
        if (readerId !== undefined) insertAssignment(db).run({ spectrumId, readerId, readingOrder, assignedBy: job.createdBy });
      }
    } else {
      spectrumId = item.spectrumId!;
      outcome = 'rescanned';
    }
    if (result.scanned.ok) {
      // A re-scan keeps the earlier result for the record; the new one becomes current.
      retireCurrentScan(db).run({ spectrumId });
      recordScan(ic, spectrumId, result.scanned);
      return finishItemTx(ic, item, { state: 'done', outcome, spectrumId });
    }
    // The spectrum is kept (it was read); the failed scan is listed so it can be redone.
    return finishItemTx(ic, item, { state: 'failed', outcome, spectrumId, errorCode: result.scanned.code, errorMessage: result.scanned.message });
  });
}

function recordScan(ic: ResultContext, spectrumId: number, result: Extract<ScanOutcome, { ok: true }>) {
  const top = result.scan.solutions[0];
  insertScanResult(ic.ctx.db).run({
    spectrumId,
    jobId: ic.job.id,
    engineVersion: result.scan.engineVersion,
    settings: { zMin: ic.settings.zMin, zMax: ic.settings.zMax, gridStep: gridStepOf(ic.settings) },
    spectrumClass: result.scan.class,
    zBest: top?.z ?? null,
    zBestErr: top?.zErr ?? null,
    solutions: result.scan.solutions,
    lineMatches: result.scan.lineMatches,
    meta: { ...result.scan.meta, chi2Null: result.scan.chi2Null, ...(result.scan.unknownReason ? { unknownReason: result.scan.unknownReason } : {}) },
    curves: Buffer.from(result.curves),
  });
}

function findSpectrum(ic: ResultContext, sha256: string): number | null {
  return spectrumByContent(ic.ctx.db).get({ campaignId: ic.job.campaignId, sha256 })?.id ?? null;
}

interface ItemEnd {
  state: 'done' | 'failed';
  outcome?: 'stored' | 'duplicate' | 'rescanned';
  spectrumId?: number | null;
  errorCode?: string;
  errorMessage?: string;
}

function finishItem(ic: ResultContext, item: JobItemRow, end: ItemEnd): boolean {
  return ic.ctx.db.transaction(() => finishItemTx(ic, item, end));
}

/** Finishes a still-pending item (true), or leaves an already finished one alone (false); call inside a transaction. */
function finishItemTx(ic: ResultContext, item: JobItemRow, end: ItemEnd): boolean {
  const { db } = ic.ctx;
  const changed = finishPendingItem(db).run({
    itemId: item.id,
    state: end.state,
    outcome: end.outcome ?? null,
    spectrumId: end.spectrumId ?? item.spectrumId,
    errorCode: end.errorCode ?? null,
    errorMessage: end.errorMessage ?? null,
  }).changes;
  // Counted up by one rather than recounted: a recount reads every item of the job, which for a
  // survey-sized job (10^6 items) would make each finish cost as much as the whole job's index.
  if (changed > 0) countItemDone(db).run({ jobId: item.jobId });
  return changed > 0;
}
