import { parseArgs } from 'node:util';
import { ResultBatch } from '../../backend/src/jobs/job-runner';
import { listSpectra } from '../../backend/src/services/list-spectra';
import { createTestApp } from '../helpers/test-app';
import { benchScanResult, pendingIngestItems } from './bench-scanned-items';

/**
 * `npm run bench:spectra-list -- [--spectra 2000] [--calls 300] [--json]`: ms per call of the
 * spectra list service (`listSpectra`, one page of 50 with its total) on a campaign of
 * `--spectra` scanned spectra, for the shapes the spectra screen asks: the default sort, a
 * search, a class filter sorted by z, and a reader's view. Prints ms per call per shape; the last
 * line is JSON.
 */
const { values } = parseArgs({ options: { spectra: { type: 'string', default: '2000' }, calls: { type: 'string', default: '300' }, json: { type: 'boolean', default: false } } });
const count = Number(values.spectra);
const calls = Number(values.calls);
if (!Number.isSafeInteger(count) || count <= 0 || !Number.isSafeInteger(calls) || calls <= 0) {
  console.error('Usage: npm run bench:spectra-list -- [--spectra 2000] [--calls 300] [--json]');
  process.exit(2);
}

const t = await createTestApp({ JOB_RUNNER: '0' });
const { rc, items } = pendingIngestItems(t, count, 'list');
const batch = new ResultBatch(t.ctx.db, rc, 8, 60_000);
const result = benchScanResult();
for (const item of items) batch.add(item, result);
batch.flush();

const base = { page: 1, pageSize: 50, sort: 'fileName', dir: 'asc' } as const;
const lead = { userId: 2, role: 'lead' } as const;
const shapes = {
  'default sort': { query: base, viewer: lead },
  search: { query: { ...base, q: 'BENCH-01' }, viewer: lead },
  'class, by z desc': { query: { ...base, class: 'galaxy', sort: 'z', dir: 'desc' }, viewer: lead },
  'reader, page 3': { query: { ...base, page: 3 }, viewer: { userId: 3, role: 'reader' } },
} as const;
const msPerCall: Record<string, number> = {};
for (const [name, { query, viewer }] of Object.entries(shapes)) {
  listSpectra(t.ctx, 1, query, viewer);
  const started = performance.now();
  for (let i = 0; i < calls; i++) listSpectra(t.ctx, 1, { ...query, page: query.page + (i % 2) }, viewer);
  msPerCall[name] = Number(((performance.now() - started) / calls).toFixed(3));
  if (!values.json) console.log(`${name.padEnd(18)} ${msPerCall[name]!.toFixed(3)} ms per call`);
}
await t.cleanup();
console.log(JSON.stringify({ spectra: count, calls, msPerCall }));
