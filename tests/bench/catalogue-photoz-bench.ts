import { parseArgs } from 'node:util';
import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { DEMO_BANDS, demoFluxes } from '../../backend/src/demo/demo-photometry';
import { demoCatalogueCsv, TIDEWATER_TARGETS, type DemoTarget } from '../../backend/src/demo/demo-scenario';
import { importCatalogue } from '../../backend/src/services/import-catalogue';
import { getTargetPhotometry } from '../../backend/src/services/target-photometry';
import { createTestApp } from '../helpers/test-app';

/**
 * `npm run bench:catalogue-photoz -- [--sources 10000] [--json]`: a catalogue import with ten
 * HST + JWST bands through the service a lead's upload uses (parse, check, store targets and
 * photometry, compute and store every photo-z with its P(z), one transaction), then one target's
 * SED answer. Sources are the Tidewater demo targets repeated with fresh noise. Prints wall
 * times, sources per second and peak RSS; the last line is JSON.
 */
const { values } = parseArgs({ options: { sources: { type: 'string', default: '10000' }, json: { type: 'boolean', default: false } } });
const n = Number(values.sources);
const filters = DEMO_BANDS.map((b) => b.filter);
const base = TIDEWATER_TARGETS;
const targets: DemoTarget[] = Array.from({ length: n }, (_, i) => ({ ...base[i % base.length]!, id: `BENCH-${String(i + 1).padStart(6, '0')}` }));
const fluxes = demoFluxes(targets, loadShippedFilters(filters), 31);
const csv = demoCatalogueCsv(targets, { filters, fluxes });

const t = await createTestApp({ JOB_RUNNER: '0' });
const lead = { id: 2, email: 'lead@demo.test', name: 'Lena', isAdmin: false };
const t0 = performance.now();
const result = importCatalogue(t.ctx, lead, 2, csv, undefined, false);
const importSeconds = (performance.now() - t0) / 1000;
const t1 = performance.now();
getTargetPhotometry(t.ctx, 2, 1);
const sedMs = performance.now() - t1;
const rssMb = process.resourceUsage().maxRSS / 1024;
await t.cleanup();

const figures = { sources: n, bands: filters.length, fits: result.photoZFits, importSeconds: Number(importSeconds.toFixed(2)), sourcesPerSecond: Math.round(n / importSeconds), sedMs: Number(sedMs.toFixed(1)), peakRssMb: Math.round(rssMb), csvMb: Number((csv.length / 1e6).toFixed(1)) };
if (!values.json) {
  console.log(`catalogue import of ${n} sources × ${filters.length} bands (${figures.csvMb} MB CSV): ${figures.importSeconds} s, ${figures.sourcesPerSecond} sources/s, ${figures.fits} photo-z stored`);
  console.log(`one target's SED answer: ${figures.sedMs} ms; peak RSS ${figures.peakRssMb} MB`);
}
console.log(JSON.stringify(figures));
