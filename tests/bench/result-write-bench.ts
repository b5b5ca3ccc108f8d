import { parseArgs } from 'node:util';
import { ResultBatch } from '../../backend/src/jobs/job-runner';
import { createTestApp } from '../helpers/test-app';
import { benchScanResult, pendingIngestItems } from './bench-scanned-items';

/**
 * `npm run bench:result-write -- [--results 2000] [--rounds 3] [--json]`: the web thread's cost of
 * recording scan results (`recordItemResult` through the job runner's ResultBatch, 8 to a
 * transaction, as during an ingest): a new spectrum, its current scan and the item's end each.
 * One real scan of a synthetic galaxy is made once (not timed) and recorded for every item of a
 * fresh ingest job. Prints ms per result per round; the last line is JSON.
 */
const { values } = parseArgs({ options: { results: { type: 'string', default: '2000' }, rounds: { type: 'string', default: '3' }, json: { type: 'boolean', default: false } } });
const count = Number(values.results);
const rounds = Number(values.rounds);
if (!Number.isSafeInteger(count) || count <= 0 || !Number.isSafeInteger(rounds) || rounds <= 0) {
  console.error('Usage: npm run bench:result-write -- [--results 2000] [--rounds 3] [--json]');
  process.exit(2);
}

const result = benchScanResult();
const t = await createTestApp({ JOB_RUNNER: '0' });
const msPerResult: number[] = [];
for (let round = 0; round < rounds; round++) {
  const { rc, items } = pendingIngestItems(t, count, `round${round}`);
  const batch = new ResultBatch(t.ctx.db, rc, 8, 60_000);
  const started = performance.now();
  for (const item of items) batch.add(item, result);
  batch.flush();
  const ms = (performance.now() - started) / count;
  msPerResult.push(Number(ms.toFixed(3)));
  if (!values.json) console.log(`round ${round + 1}: ${count} results recorded, ${ms.toFixed(3)} ms per result`);
}
await t.cleanup();
console.log(JSON.stringify({ results: count, rounds, msPerResult }));
