import { createHash } from 'node:crypto';
import { parseArgs } from 'node:util';
import { eq } from 'drizzle-orm';
import { strToU8 } from 'fflate';
import { spectrumToCsv } from '../../backend/src/demo/spectrum-files';
import { jobItems, jobs, storedFiles } from '../../backend/src/db/schema';
import { ResultBatch } from '../../backend/src/jobs/job-runner';
import type { JobSettings } from '../../backend/src/jobs/process-item';
import runScanTask from '../../backend/src/jobs/scan-worker';
import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import { createTestApp } from '../helpers/test-app';

/**
 * `npm run bench:result-write -- [--results 2000] [--rounds 3] [--json]`: the web thread's cost of
 * recording scan results (`recordItemResult` through the job runner's ResultBatch, 8 to a
 * transaction, as during an ingest): a new spectrum, its current scan and the item's end each.
 * One real scan of a 4,000-pixel synthetic galaxy is made once (not timed) and recorded for
 * every item of a fresh ingest job. Prints ms per result per round; the last line is JSON.
 */
const { values } = parseArgs({ options: { results: { type: 'string', default: '2000' }, rounds: { type: 'string', default: '3' }, json: { type: 'boolean', default: false } } });
const count = Number(values.results);
const rounds = Number(values.rounds);
if (!Number.isSafeInteger(count) || count <= 0 || !Number.isSafeInteger(rounds) || rounds <= 0) {
  console.error('Usage: npm run bench:result-write -- [--results 2000] [--rounds 3] [--json]');
  process.exit(2);
}

const spectrum = generateSyntheticSpectrum({ class: 'galaxy', z: 0.4, snr: 8, seed: 77, pixels: 4000 });
const result = runScanTask({ bytes: strToU8(spectrumToCsv(spectrum, 'bench galaxy at z=0.400')), fileName: 'bench.csv', zMin: 0, zMax: 6, gridStep: 'default' });
if (!result.ok || !result.scanned.ok) throw new Error('the benchmark spectrum did not scan');

const t = await createTestApp({ JOB_RUNNER: '0' });
const campaignId = 1;
const msPerResult: number[] = [];
for (let round = 0; round < rounds; round++) {
  const { db } = t.ctx;
  const shas = Array.from({ length: count }, (_, i) => createHash('sha256').update(`round ${round} item ${i}`).digest('hex'));
  db.insert(storedFiles).values(shas.map((sha256) => ({ sha256, sizeBytes: 1 }))).run();
  const settings: JobSettings = { zMin: 0, zMax: 6, gridStep: 'default' };
  const job = db.insert(jobs).values({ kind: 'ingest', campaignId, state: 'running', total: count, settings: { ...settings } }).returning().get();
  for (let i = 0; i < count; i += 500) {
    db.insert(jobItems)
      .values(shas.slice(i, i + 500).map((sha256, k) => ({ jobId: job.id, sha256, fileName: `round${round}/BENCH-${i + k}.csv` })))
      .run();
  }
  const items = db.select().from(jobItems).where(eq(jobItems.jobId, job.id)).all();
  const batch = new ResultBatch(db, { ctx: t.ctx, job, settings, targets: () => [] }, 8, 60_000);
  const started = performance.now();
  for (const item of items) batch.add(item, result);
  batch.flush();
  const ms = (performance.now() - started) / count;
  msPerResult.push(Number(ms.toFixed(3)));
  if (!values.json) console.log(`round ${round + 1}: ${count} results recorded, ${ms.toFixed(3)} ms per result`);
}
await t.cleanup();
console.log(JSON.stringify({ results: count, rounds, msPerResult }));
