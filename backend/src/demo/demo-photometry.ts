import { photoZTemplates } from '../photoz/analyticTemplates';
import { observedTemplate } from '../photoz/bestFitModel';
import type { FilterCurve } from '../photoz/filterCurve';
import { bandAverageFnu, nJyFromAb } from '../photoz/photometry';
import { seeded, type DemoTarget } from './demo-scenario';

/**
 * The invented imaging of the demo fields: an HST (ACS + WFC3/IR) and JWST/NIRCam filter set,
 * with 5σ depths (AB) of the order of deep cluster and legacy fields (our own round numbers).
 */
export const DEMO_BANDS: Array<{ filter: string; depth5Sigma: number }> = [
  { filter: 'acs_wfc_f435w', depth5Sigma: 28.6 },
  { filter: 'acs_wfc_f606w', depth5Sigma: 28.8 },
  { filter: 'acs_wfc_f814w', depth5Sigma: 28.6 },
  { filter: 'wfc3_ir_f105w', depth5Sigma: 28.3 },
  { filter: 'wfc3_ir_f125w', depth5Sigma: 28.2 },
  { filter: 'wfc3_ir_f160w', depth5Sigma: 28.2 },
  { filter: 'jwst_f200w', depth5Sigma: 29.0 },
  { filter: 'jwst_f277w', depth5Sigma: 29.2 },
  { filter: 'jwst_f356w', depth5Sigma: 29.2 },
  { filter: 'jwst_f444w', depth5Sigma: 28.9 },
];

/** The band the demo magnitude is measured in. */
const NORMALISING_BAND = 'wfc3_ir_f160w';

/** Cool dwarfs the demo's stars are drawn from, in turn: the later types are the dropout impostors. */
const DWARFS = ['star-L7', 'star-M8', 'star-T5', 'star-L2'];

/** Which photo-z template an invented target's imaging is drawn from (what it "really" is). */
function sedTemplateOf(t: DemoTarget, index: number): { id: string; z: number } {
  const truth = t.truth;
  if (!truth) return { id: 'lbg-beta-2.0', z: 0.6 + (index % 5) }; // no usable signal: a faint blue smudge
  switch (truth.template) {
    case 'lyman-break-lya':
      return { id: 'lbg-beta-2.2-lya50', z: truth.z };
    case 'lyman-break':
      return { id: 'lbg-beta-1.8', z: truth.z };
    case 'galaxy-absorption':
      // Old and dusty: the 4000 Å-break interlopers of the dropout selections.
      return { id: truth.z > 0.9 ? 'lowz-old-ebv0.40' : 'lowz-old', z: truth.z };
    case 'galaxy-emission':
      return { id: index % 3 === 0 ? 'lowz-spiral-ebv0.25' : 'lowz-starforming-ebv0.25', z: truth.z };
    case 'quasar':
      return { id: 'lbg-beta-1.6-lya50', z: truth.z };
    default:
      return { id: DWARFS[index % DWARFS.length]!, z: 0 };
  }
}

/** One target's invented band fluxes and 1σ errors in nJy, in DEMO_BANDS order (non-detections keep their noisy, possibly negative, flux). */
export interface DemoFluxes {
  flux: number[];
  err: number[];
}

/**
 * Invents the imaging of the demo targets: each target's template (sedTemplateOf) at its true
 * redshift through the curves, scaled to its catalogue magnitude in F160W, with Gaussian noise of
 * each band's depth. Seeded: the same fluxes on every machine.
 *
 * @param curves the DEMO_BANDS curves, in that order
 */
export function demoFluxes(targets: readonly DemoTarget[], curves: readonly FilterCurve[], seed: number): DemoFluxes[] {
  const set = photoZTemplates();
  const r = seeded(seed);
  const norm = DEMO_BANDS.findIndex((b) => b.filter === NORMALISING_BAND);
  return targets.map((t, i) => {
    const { id, z } = sedTemplateOf(t, i);
    const template = set.templates.find((x) => x.id === id)!;
    const seen = observedTemplate(template, set.grid, z, 1, 3000, 60000, 6000);
    const model = curves.map((c) => bandAverageFnu(c, seen.wavelength, seen.fnu).fnu);
    // A source with no usable signal is faint whatever its catalogue magnitude says.
    const scale = nJyFromAb(t.truth ? t.mag : Math.max(t.mag, 28)) / model[norm]!;
    const err = DEMO_BANDS.map((b) => nJyFromAb(b.depth5Sigma) / 5);
    const flux = model.map((m, b) => m * scale + err[b]! * r.gauss());
    const round = (v: number) => Number(v.toPrecision(4));
    return { flux: flux.map(round), err: err.map(round) };
  });
}
