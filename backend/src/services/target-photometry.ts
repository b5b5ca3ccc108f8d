import { readFileSync } from 'node:fs';
import { and, eq } from 'drizzle-orm';
import type { TargetPhotometry } from '../contracts/targets';
import { spectra, targetPhotometry, targets } from '../db/schema';
import { notFound } from '../http/errors';
import { photoZTemplates } from '../photoz/analyticTemplates';
import { bandModel, observedTemplate } from '../photoz/bestFitModel';
import type { FilterCurve } from '../photoz/filterCurve';
import { effectiveWavelength } from '../photoz/photometry';
import { spectrumBandFluxes } from '../photoz/spectrumBandFluxes';
import { SpectrumReadError } from '../spectra/errors';
import { readSpectrum } from '../spectra/readSpectrum';
import { toVacuumArray } from '../spectra/toVacuum';
import type { ServiceContext } from './context';
import { filterCurves } from './photo-z-filters';
import { fitsOf, modelGridFor, photoZAssumptions, photoZSummaryOf, posteriorOf } from './photo-z-fits';

/** Below this S/N a band is drawn as an upper limit at max(flux, 0) + 2σ (common practice). */
const DETECTION_SNR = 2;

const sig = (v: number) => Number(v.toPrecision(5));

/**
 * A target's spectral energy distribution and photometric redshift: its bands (λ_eff order) with
 * fluxes, errors and detections, P(z), and the best galaxy and best star drawn through the bands
 * (amplitudes refitted with the fit's own weights on its grid).
 */
export function getTargetPhotometry(ctx: ServiceContext, campaignId: number, targetId: number): TargetPhotometry {
  const target = ctx.db.select({ id: targets.id, catalogueId: targets.catalogueId }).from(targets).where(and(eq(targets.id, targetId), eq(targets.campaignId, campaignId))).get();
  if (!target) throw notFound('No such target in this campaign.', 'target_not_found');
  const rows = ctx.db.select().from(targetPhotometry).where(eq(targetPhotometry.targetId, targetId)).all();
  const fit = fitsOf(ctx.db, [targetId]).get(targetId) ?? null;
  const linkedRows = ctx.db.select({ id: spectra.id, fileName: spectra.fileName, sha256: spectra.sha256 }).from(spectra).where(eq(spectra.targetId, targetId)).orderBy(spectra.id).all();
  const linked = linkedRows.map(({ id, fileName }) => ({ id, fileName }));
  if (rows.length === 0) return { targetId, catalogueId: target.catalogueId, bands: [], fit: null, posterior: null, models: [], assumptions: [], spectra: linked, spectrumPhotometry: [] };

  const curves = filterCurves(ctx.db, campaignId, rows.map((r) => r.filter));
  const order = rows.map((r, i) => ({ r, curve: curves[i]!, lam: effectiveWavelength(curves[i]!) })).sort((a, b) => a.lam - b.lam);
  const bands = order.map(({ r, lam }) => ({
    filter: r.filter,
    wavelengthEff: sig(lam),
    fluxNjy: sig(r.fluxNjy),
    errNjy: sig(r.errNjy),
    detected: r.fluxNjy >= DETECTION_SNR * r.errNjy,
    given: { value: r.givenValue, error: r.givenError, unit: r.unit as 'nJy' | 'uJy' | 'ABmag' },
  }));
  const models: TargetPhotometry['models'] = [];
  if (fit) {
    // The grid in filter-name order, as the import's fit built it (cached), mapped back to λ order.
    const byName = [...order].sort((a, b) => (a.r.filter < b.r.filter ? -1 : a.r.filter > b.r.filter ? 1 : 0));
    const grid = modelGridFor(byName.map((o) => o.curve));
    const flux = byName.map((o) => o.r.fluxNjy);
    const err = byName.map((o) => o.r.errNjy);
    const inLambdaOrder = order.map((o) => byName.indexOf(o));
    const set = photoZTemplates();
    const lo = order[0]!.lam * 0.75;
    const hi = order[order.length - 1]!.lam * 1.3;
    const draw = (kind: 'galaxy' | 'star', id: string, z: number) => {
      const m = bandModel(grid, id, z, flux, err);
      const template = set.templates.find((t) => t.id === id)!;
      const curve = observedTemplate(template, set.grid, m.z, m.amplitude, lo, hi);
      models.push({
        kind, template: id, z: Number(m.z.toFixed(4)), chi2: Number(m.chi2.toFixed(3)),
        bandFluxNjy: inLambdaOrder.map((k) => sig(m.bandFlux[k]!)),
        curve: { wavelength: Array.from(curve.wavelength, sig), fnuNjy: Array.from(curve.fnu, sig) },
      });
    };
    draw('galaxy', fit.galaxyTemplate, fit.z);
    if (fit.starTemplate) draw('star', fit.starTemplate, 0);
  }
  return {
    targetId,
    catalogueId: target.catalogueId,
    bands,
    fit: fit ? photoZSummaryOf(fit) : null,
    posterior: fit ? posteriorOf(fit) : null,
    models,
    assumptions: fit ? [`filters: ${fit.filters.join(', ')}`, ...photoZAssumptions()] : [],
    spectra: linked,
    spectrumPhotometry: linkedRows.flatMap((s) => spectrumPhotometryOf(ctx, s, order)),
  };
}

/** A band counts for the check only when the spectrum covers nearly all of it (our choice). */
const MIN_COVERED = 0.95;

type OrderedBand = { r: { filter: string; fluxNjy: number; errNjy: number }; curve: FilterCurve; lam: number };

/**
 * One spectrum's synthetic photometry against the catalogue, in the bands it covers where the
 * catalogue detects the target (ratio = spectrum / catalogue, errors of both in quadrature). A
 * file that can no longer be read is left out (its own screen says why).
 */
function spectrumPhotometryOf(ctx: ServiceContext, s: { id: number; fileName: string; sha256: string }, order: OrderedBand[]): TargetPhotometry['spectrumPhotometry'] {
  let spectrum;
  try {
    spectrum = readSpectrum(readFileSync(ctx.store.pathOf(s.sha256)));
  } catch (err) {
    if (err instanceof SpectrumReadError) return [];
    throw err;
  }
  const wavelength = spectrum.meta.medium === 'air' ? toVacuumArray(spectrum.wavelength) : spectrum.wavelength;
  const synthetic = spectrumBandFluxes(order.map((o) => o.curve), wavelength, spectrum.flux, spectrum.ivar, spectrum.mask, spectrum.fluxUnit);
  const calibrated = spectrum.fluxUnit.quantity === 'f-lambda' || spectrum.fluxUnit.quantity === 'f-nu';
  const usable = order
    .map((o, i) => ({ o, syn: synthetic[i]! }))
    .filter(({ o, syn }) => syn.covered >= MIN_COVERED && Number.isFinite(syn.flux) && o.r.fluxNjy >= DETECTION_SNR * o.r.errNjy);
  if (usable.length === 0) return [];
  const ratios = usable.map(({ o, syn }) => syn.flux / o.r.fluxNjy).sort((a, b) => a - b);
  const mid = ratios.length >> 1;
  const medianRatio = ratios.length % 2 ? ratios[mid]! : 0.5 * (ratios[mid - 1]! + ratios[mid]!);
  const scale = calibrated || !(medianRatio !== 0) ? 1 : 1 / medianRatio;
  return [
    {
      spectrumId: s.id,
      fileName: s.fileName,
      calibrated,
      medianRatio: Number.isFinite(medianRatio) ? sig(medianRatio) : null,
      bands: usable.map(({ o, syn }) => {
        const ratio = syn.flux / o.r.fluxNjy;
        const ratioErr = Math.abs(ratio) * Math.hypot(syn.err / syn.flux, o.r.errNjy / o.r.fluxNjy);
        return { filter: o.r.filter, wavelengthEff: sig(o.lam), fluxNjy: sig(syn.flux * scale), errNjy: sig(syn.err * Math.abs(scale)), ratio: sig(ratio), ratioErr: sig(ratioErr) };
      }),
    },
  ];
}
