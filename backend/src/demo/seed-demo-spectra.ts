import { writeFileSync } from 'node:fs';
import { generateSyntheticSpectrum } from '../spectra/generateSyntheticSpectrum';
import type { Actor, ServiceContext } from '../services/context';
import { importCatalogue } from '../services/import-catalogue';
import { filterCurves } from '../services/photo-z-filters';
import { DEMO_BANDS, demoFluxes } from './demo-photometry';
import { receiveUpload } from '../services/receive-upload';
import { demoCatalogueCsv, type DemoTarget } from './demo-scenario';
import { spectrumToCsv } from './spectrum-files';

const RANGES: Record<string, [number, number]> = { 'demo-slit': [3600, 9800], 'demo-grism': [5500, 10000] };

/**
 * Gives a demo campaign its catalogue (with invented HST + JWST fluxes, so photometric
 * redshifts are computed on import) and spectra through the same paths a lead uses: the
 * catalogue import, then an upload whose ingest job the runner scans in the background and
 * assigns to the two readers.
 */
export async function seedDemoSpectra(
  ctx: ServiceContext,
  lead: Actor,
  campaignId: number,
  targets: readonly DemoTarget[],
  seed: number,
  readers: { first: number; second: number },
): Promise<number> {
  const filters = DEMO_BANDS.map((b) => b.filter);
  const fluxes = demoFluxes(targets, filterCurves(ctx.db, campaignId, filters), seed);
  importCatalogue(ctx, lead, campaignId, demoCatalogueCsv(targets, { filters, fluxes }), undefined, false);
  const files = targets.map((t, i) => {
    const [wavelengthMin, wavelengthMax] = RANGES[t.instrument] ?? [3600, 9800];
    const truth = t.truth ?? { class: 'galaxy' as const, template: 'galaxy-emission', z: 1, snr: 0.15 };
    const spectrum = generateSyntheticSpectrum({ ...truth, seed: seed + i, wavelengthMin, wavelengthMax, pixels: 4000 });
    const tempFile = ctx.store.tempPath();
    writeFileSync(tempFile, spectrumToCsv(spectrum, `Redward demo spectrum of ${t.id} (synthetic; instrument ${t.instrument})`));
    return { originalName: `${t.id}_${t.instrument}.csv`, tempFile };
  });
  // Until leads assign readers themselves, every demo spectrum goes to both demo readers.
  const receipt = await receiveUpload(ctx, ctx.store, lead, campaignId, files, { assign: readers });
  return receipt.jobId;
}
