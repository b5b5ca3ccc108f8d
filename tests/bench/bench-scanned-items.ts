import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { strToU8 } from 'fflate';
import { spectrumToCsv } from '../../backend/src/demo/spectrum-files';
import { jobItems, jobs, storedFiles } from '../../backend/src/db/schema';
import type { JobSettings, ResultContext } from '../../backend/src/jobs/process-item';
import runScanTask from '../../backend/src/jobs/scan-worker';
import type { JobItemRow } from '../../backend/src/jobs/job-store';
import type { ScanTaskResult } from '../../backend/src/jobs/scan-worker';
import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import type { TestApp } from '../helpers/test-app';

/** One real scan of a 4,000-pixel synthetic galaxy (≈ 1 s, not timed), to be recorded many times. */
export function benchScanResult(): ScanTaskResult {
  const spectrum = generateSyntheticSpectrum({ class: 'galaxy', z: 0.4, snr: 8, seed: 77, pixels: 4000 });
  const result = runScanTask({ bytes: strToU8(spectrumToCsv(spectrum, 'bench galaxy at z=0.400')), fileName: 'bench.csv', zMin: 0, zMax: 6, gridStep: 'default' });
  if (!result.ok || !result.scanned.ok) throw new Error('the benchmark spectrum did not scan');
  return result;
}

/**
 * A running ingest job of `count` pending items in campaign 1, each with its own stored file (the
 * bytes are not needed: the result is recorded, not scanned), and what recording needs.
 */
export function pendingIngestItems(t: TestApp, count: number, label: string): { rc: ResultContext; items: JobItemRow[] } {
  const { db } = t.ctx;
  const shas = Array.from({ length: count }, (_, i) => createHash('sha256').update(`${label} item ${i}`).digest('hex'));
  for (let i = 0; i < count; i += 500) db.insert(storedFiles).values(shas.slice(i, i + 500).map((sha256) => ({ sha256, sizeBytes: 1 }))).run();
  const settings: JobSettings = { zMin: 0, zMax: 6, gridStep: 'default' };
  const job = db.insert(jobs).values({ kind: 'ingest', campaignId: 1, state: 'running', total: count, settings: { ...settings } }).returning().get();
  for (let i = 0; i < count; i += 500) {
    db.insert(jobItems)
      .values(shas.slice(i, i + 500).map((sha256, k) => ({ jobId: job.id, sha256, fileName: `${label}/BENCH-${String(i + k).padStart(5, '0')}.csv` })))
      .run();
  }
  const items = db.select().from(jobItems).where(eq(jobItems.jobId, job.id)).all();
  return { rc: { ctx: t.ctx, job, settings, targets: () => [] }, items };
}
