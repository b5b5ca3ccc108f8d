import { and, count, eq } from 'drizzle-orm';
import { gridStepOf, type GridStep } from '../contracts/campaigns';
import { campaigns, jobItems, jobs, scanResults, spectra } from '../db/schema';
import { badRequest } from '../http/errors';
import { ENGINE_VERSION } from '../spectra/version';
import type { Actor, ServiceContext } from './context';
import { recordAudit } from './record-audit';

export interface ScanStatus {
  spectra: number;
  /** Spectra whose current scan used the campaign's present range, grid and this engine version. */
  upToDate: number;
  /** Spectra scanned with another range, grid or engine version, or never scanned. */
  stale: number;
  engineVersion: string;
  zMin: number;
  zMax: number;
  gridStep: GridStep;
}

interface ScanSettings {
  zMin: number;
  zMax: number;
  gridStep: GridStep;
}

function staleSpectra(ctx: ServiceContext, campaignId: number): { ids: number[]; total: number } & ScanSettings {
  const campaign = ctx.db
    .select({ zMin: campaigns.zMin, zMax: campaigns.zMax, gridStep: campaigns.gridStep })
    .from(campaigns)
    .where(eq(campaigns.id, campaignId))
    .get()!;
  const rows = ctx.db
    .select({ id: spectra.id, engineVersion: scanResults.engineVersion, settings: scanResults.settings })
    .from(spectra)
    .leftJoin(scanResults, and(eq(scanResults.spectrumId, spectra.id), eq(scanResults.isCurrent, true)))
    .where(eq(spectra.campaignId, campaignId))
    .all();
  const ids = rows
    .filter(
      (r) =>
        r.engineVersion !== ENGINE_VERSION ||
        r.settings?.zMin !== campaign.zMin ||
        r.settings?.zMax !== campaign.zMax ||
        gridStepOf(r.settings) !== campaign.gridStep,
    )
    .map((r) => r.id);
  return { ids, total: rows.length, ...campaign };
}

/** How many of a campaign's scans no longer match its settings: the basis for offering a re-scan. */
export function getScanStatus(ctx: ServiceContext, campaignId: number): ScanStatus {
  const { ids, total, zMin, zMax, gridStep } = staleSpectra(ctx, campaignId);
  return { spectra: total, upToDate: total - ids.length, stale: ids.length, engineVersion: ENGINE_VERSION, zMin, zMax, gridStep };
}

/**
 * Queues a re-scan of the spectra whose scans are out of date (or of all of them). Earlier scan
 * results stay in the database; the new ones become current.
 */
export function queueRescan(ctx: ServiceContext, actor: Actor, campaignId: number, all: boolean): { jobId: number; spectra: number } {
  const { ids: stale, zMin, zMax, gridStep } = staleSpectra(ctx, campaignId);
  const ids = all
    ? ctx.db.select({ id: spectra.id }).from(spectra).where(eq(spectra.campaignId, campaignId)).all().map((r) => r.id)
    : stale;
  if (ids.length === 0) throw badRequest('Every scan already matches the campaign settings; there is nothing to re-scan.', 'nothing_to_rescan');
  const running = ctx.db.select({ n: count() }).from(jobs).where(and(eq(jobs.campaignId, campaignId), eq(jobs.kind, 'scan'), eq(jobs.state, 'running'))).get()!.n;
  if (running > 0) throw badRequest('A re-scan of this campaign is already running; wait for it or cancel it.', 'rescan_running');
  const jobId = ctx.db.transaction((tx) => {
    const job = tx.insert(jobs).values({ kind: 'scan', campaignId, createdBy: actor.id, total: ids.length, settings: { zMin, zMax, gridStep } }).returning({ id: jobs.id }).get();
    const withFiles = tx.select({ id: spectra.id, fileName: spectra.fileName, sha256: spectra.sha256 }).from(spectra).where(eq(spectra.campaignId, campaignId)).all();
    const wanted = new Set(ids);
    const items = withFiles.filter((s) => wanted.has(s.id)).map((s) => ({ jobId: job.id, fileName: s.fileName, sha256: s.sha256, spectrumId: s.id }));
    for (let i = 0; i < items.length; i += 500) tx.insert(jobItems).values(items.slice(i, i + 500)).run();
    recordAudit(tx, { actorId: actor.id, action: 'scan.queued', subjectType: 'job', subjectId: job.id, campaignId, after: { spectra: ids.length, zMin, zMax, gridStep, engineVersion: ENGINE_VERSION, all } });
    return job.id;
  });
  ctx.wakeJobRunner();
  return { jobId, spectra: ids.length };
}
