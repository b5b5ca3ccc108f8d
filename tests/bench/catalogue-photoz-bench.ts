import { monitorEventLoopDelay } from 'node:perf_hooks';
import { parseArgs } from 'node:util';
import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { DEMO_BANDS, demoFluxes } from '../../backend/src/demo/demo-photometry';
import { demoCatalogueCsv, TIDEWATER_TARGETS, type DemoTarget } from '../../backend/src/demo/demo-scenario';
import { eq } from 'drizzle-orm';
import { jobItems, jobs } from '../../backend/src/db/schema';
import { processPhotoZItem } from '../../backend/src/jobs/photoz-job';
import { importCatalogue } from '../../backend/src/services/import-catalogue';
import { getTargetPhotometry } from '../../backend/src/services/target-photometry';
import { createTestApp } from '../helpers/test-app';

/**
 * `npm run bench:catalogue-photoz -- [--sources 10000] [--json] [--request-only]`: a catalogue import with ten
 * HST + JWST bands through the service a lead's upload uses (parse, check, store targets and
 * photometry, compute and store every photo-z with its P(z), one transaction), then one target's
 * SED answer. Sources are the Tidewater demo targets repeated with fresh noise. Then the same
 * catalogue as a large import (PHOTOZ_JOB_THRESHOLD 0): the request's time (targets and fluxes
 * only), the photo-z job's items fitted on the scan pool's threads as the runner does, and the
 * longest the main thread's event loop was held meanwhile (what a reader's request would wait). Prints wall times, sources per second and
 * peak RSS; the last line is JSON.
 */
const { values } = parseArgs({ options: { sources: { type: 'string', default: '10000' }, json: { type: 'boolean', default: false }, 'request-only': { type: 'boolean', default: false } } });
const n = Number(values.sources);
const filters = DEMO_BANDS.map((b) => b.filter);
const base = TIDEWATER_TARGETS;
const targets: DemoTarget[] = Array.from({ length: n }, (_, i) => ({ ...base[i % base.length]!, id: `BENCH-${String(i + 1).padStart(6, '0')}` }));
const fluxes = demoFluxes(targets, loadShippedFilters(filters), 31);
const csv = demoCatalogueCsv(targets, { filters, fluxes });

// `--request-only`: only a large import's request part (store targets and fluxes, queue the job),
// timed alone; at 10^5 sources the in-request fit and the job take minutes.
if (values['request-only']) {
  const tr = await createTestApp({ JOB_RUNNER: '0', PHOTOZ_JOB_THRESHOLD: '0' });
  const started = performance.now();
  importCatalogue(tr.ctx, { id: 2, email: 'lead@demo.test', name: 'Lena', isAdmin: false }, 2, csv, undefined, false);
  const requestSeconds = Number(((performance.now() - started) / 1000).toFixed(2));
  await tr.cleanup();
  if (!values.json) console.log(`large import of ${n} sources × ${filters.length} bands (${(csv.length / 1e6).toFixed(1)} MB CSV), request part (targets + fluxes stored, photo-z job queued): ${requestSeconds} s`);
  console.log(JSON.stringify({ sources: n, bands: filters.length, requestSeconds, peakRssMb: Math.round(process.resourceUsage().maxRSS / 1024) }));
  process.exit(0);
}

const t = await createTestApp({ JOB_RUNNER: '0', PHOTOZ_JOB_THRESHOLD: String(n) });
const lead = { id: 2, email: 'lead@demo.test', name: 'Lena', isAdmin: false };
const t0 = performance.now();
const result = importCatalogue(t.ctx, lead, 2, csv, undefined, false);
const importSeconds = (performance.now() - t0) / 1000;
const t1 = performance.now();
getTargetPhotometry(t.ctx, 2, 1);
const sedMs = performance.now() - t1;
await t.cleanup();

const tj = await createTestApp({ JOB_RUNNER: '0', PHOTOZ_JOB_THRESHOLD: '0' });
const t2 = performance.now();
const queued = importCatalogue(tj.ctx, lead, 2, csv, undefined, false);
const requestSeconds = (performance.now() - t2) / 1000;
const job = tj.ctx.db.select().from(jobs).where(eq(jobs.id, queued.photoZJobId!)).get()!;
const items = tj.ctx.db.select().from(jobItems).where(eq(jobItems.jobId, job.id)).orderBy(jobItems.id).all();
// As the job runner does: one loop per scan-pool thread, each taking the next item.
const threads = tj.ctx.scanPool.threads;
const loopDelay = monitorEventLoopDelay({ resolution: 10 });
const t3 = performance.now();
loopDelay.enable();
const queue = [...items];
await Promise.all(
  Array.from({ length: threads }, async () => {
    for (let item = queue.shift(); item; item = queue.shift()) await processPhotoZItem(tj.ctx, job, item);
  }),
);
loopDelay.disable();
const jobSeconds = (performance.now() - t3) / 1000;
const maxLoopDelayMs = loopDelay.max / 1e6;
const jobFits = tj.ctx.db.select().from(jobItems).where(eq(jobItems.jobId, job.id)).all().filter((i) => i.state === 'done').length;
await tj.cleanup();
const rssMb = process.resourceUsage().maxRSS / 1024;

const figures = { sources: n, bands: filters.length, fits: result.photoZFits, importSeconds: Number(importSeconds.toFixed(2)), sourcesPerSecond: Math.round(n / importSeconds), sedMs: Number(sedMs.toFixed(1)),
  asJob: { requestSeconds: Number(requestSeconds.toFixed(2)), items: items.length, itemsDone: jobFits, jobSeconds: Number(jobSeconds.toFixed(2)), sourcesPerSecond: Math.round(n / jobSeconds), threads, maxEventLoopDelayMs: Math.round(maxLoopDelayMs) },
  peakRssMb: Math.round(rssMb), csvMb: Number((csv.length / 1e6).toFixed(1)) };
if (!values.json) {
  console.log(`catalogue import of ${n} sources × ${filters.length} bands (${figures.csvMb} MB CSV): ${figures.importSeconds} s, ${figures.sourcesPerSecond} sources/s, ${figures.fits} photo-z stored`);
  console.log(`one target's SED answer: ${figures.sedMs} ms; peak RSS ${figures.peakRssMb} MB`);
  const a = figures.asJob;
  console.log(`as a job: request ${a.requestSeconds} s (targets + fluxes), then ${a.items} items (${a.itemsDone} done) in ${a.jobSeconds} s, ${a.sourcesPerSecond} sources/s on ${a.threads} pool thread(s), web thread's event loop held at most ${a.maxEventLoopDelayMs} ms`);
}
console.log(JSON.stringify(figures));
