import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { DEMO_BANDS, demoFluxes } from '../../backend/src/demo/demo-photometry';
import type { DemoTarget } from '../../backend/src/demo/demo-scenario';

/** The demo campaigns' HST + JWST bands (file stems of the shipped filters). */
export const DEMO_FILTERS = DEMO_BANDS.map((b) => b.filter);

/** An invented target at the demo field's position, with the given truth and magnitude. */
export const demoSource = (id: string, truth: DemoTarget['truth'], mag: number): DemoTarget => ({ id, ra: 214.3, dec: 8.71, mag, truth, photoZ: 1, priority: 1, instrument: 'demo-grism' });

/** A catalogue CSV (id, ra, dec, flux_/err_ in nJy per demo band) of noisy fluxes drawn with `seed`. */
export function demoCatalogueCsv(sources: DemoTarget[], seed: number): string {
  const fluxes = demoFluxes(sources, loadShippedFilters(DEMO_FILTERS), seed);
  const header = ['id', 'ra', 'dec', ...DEMO_FILTERS.flatMap((f) => [`flux_${f}`, `err_${f}`])];
  const rows = sources.map((s, i) => [s.id, s.ra, s.dec, ...DEMO_FILTERS.flatMap((_, b) => [fluxes[i]!.flux[b], fluxes[i]!.err[b]])].join(','));
  return `${[header.join(','), ...rows].join('\n')}\n`;
}
