import { parseArgs } from 'node:util';
import { loadShippedFilters, loadShippedTemplates } from '../../backend/src/cli/photoz-data';
import { fitCatalogueOnThreads } from '../../backend/src/cli/photoz-pool';
import { buildModelGrid } from '../../backend/src/photoz/modelGrid';

/**
 * `npm run bench:photoz -- [--sources 100000] [--threads 2] [--json]`: photometric redshifts of a
 * catalogue in ten HST/Spitzer bands on worker threads, as the CLI runs them. Sources are the
 * fit's own models at random templates and redshifts with 5 % noise (the fit's cost does not
 * depend on what the fluxes are). Prints sources per second, wall time and peak RSS; target:
 * 10^5 sources in ≤ 60 s on two cores. Last line is JSON.
 */
const { values } = parseArgs({ options: { sources: { type: 'string', default: '100000' }, threads: { type: 'string', default: '2' }, json: { type: 'boolean', default: false } } });
const n = Number(values.sources);
const threads = Number(values.threads);
const bands = ['acs_wfc_f435w', 'acs_wfc_f606w', 'acs_wfc_f775w', 'acs_wfc_f850lp', 'wfc3_ir_f105w', 'wfc3_ir_f125w', 'wfc3_ir_f140w', 'wfc3_ir_f160w', 'spitzer_irac_ch1', 'spitzer_irac_ch2'];

const t0 = performance.now();
const grid = buildModelGrid(loadShippedTemplates(), loadShippedFilters(bands));
const gridSeconds = (performance.now() - t0) / 1000;

let seed = 12345;
const rand = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
const nb = bands.length;
const nz = grid.redshift.z.length;
const flux = new Float64Array(n * nb);
const err = new Float64Array(n * nb);
for (let i = 0; i < n; i++) {
  const t = Math.floor(rand() * grid.galaxyIds.length);
  const k = Math.floor(rand() * nz);
  let peak = 0;
  for (let b = 0; b < nb; b++) peak = Math.max(peak, grid.galaxy[(t * nz + k) * nb + b]!);
  for (let b = 0; b < nb; b++) {
    const truth = (100 * grid.galaxy[(t * nz + k) * nb + b]!) / (peak || 1);
    const sigma = 5;
    flux[i * nb + b] = truth + sigma * Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
    err[i * nb + b] = sigma;
  }
}

const cpu0 = process.cpuUsage();
const start = performance.now();
const cols = await fitCatalogueOnThreads(grid, flux, err, n, threads);
const seconds = (performance.now() - start) / 1000;
const cpu = process.cpuUsage(cpu0);
let stars = 0;
for (const s of cols.isStar) stars += s;
const result = {
  sources: n, bands: nb, threads, redshifts: nz, galaxyTemplates: grid.galaxyIds.length, starTemplates: grid.starIds.length,
  gridSeconds: Number(gridSeconds.toFixed(2)),
  seconds: Number(seconds.toFixed(2)),
  sourcesPerSecond: Math.round(n / seconds),
  cpuSeconds: Number(((cpu.user + cpu.system) / 1e6).toFixed(1)),
  peakRssMB: Math.round(process.resourceUsage().maxRSS / 1024),
  calledStars: stars,
};
console.log(`${n} sources × ${nb} bands, ${threads} threads: ${result.seconds} s wall (${result.sourcesPerSecond} sources/s; CPU ${result.cpuSeconds} s), grid ${result.gridSeconds} s, peak RSS ${result.peakRssMB} MB   target ≤ 60 s`);
console.log(JSON.stringify(result));
