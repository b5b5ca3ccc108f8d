import { and, eq } from 'drizzle-orm';
import type { TargetPhotometry } from '../contracts/targets';
import { spectra, targetPhotometry, targets } from '../db/schema';
import { notFound } from '../http/errors';
import { photoZTemplates } from '../photoz/analyticTemplates';
import { bandModel, observedTemplate } from '../photoz/bestFitModel';
import { effectiveWavelength } from '../photoz/photometry';
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
  const linked = ctx.db.select({ id: spectra.id, fileName: spectra.fileName }).from(spectra).where(eq(spectra.targetId, targetId)).orderBy(spectra.id).all();
  if (rows.length === 0) return { targetId, catalogueId: target.catalogueId, bands: [], fit: null, posterior: null, models: [], assumptions: [], spectra: linked };

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
    const grid = modelGridFor(order.map((o) => o.curve));
    const flux = order.map((o) => o.r.fluxNjy);
    const err = order.map((o) => o.r.errNjy);
    const set = photoZTemplates();
    const lo = order[0]!.lam * 0.75;
    const hi = order[order.length - 1]!.lam * 1.3;
    const draw = (kind: 'galaxy' | 'star', id: string, z: number) => {
      const m = bandModel(grid, id, z, flux, err);
      const template = set.templates.find((t) => t.id === id)!;
      const curve = observedTemplate(template, set.grid, m.z, m.amplitude, lo, hi);
      models.push({
        kind, template: id, z: Number(m.z.toFixed(4)), chi2: Number(m.chi2.toFixed(3)),
        bandFluxNjy: Array.from(m.bandFlux, sig),
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
  };
}
