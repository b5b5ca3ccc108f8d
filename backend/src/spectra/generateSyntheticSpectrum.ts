import { templateSetFor } from './buildTemplates';
import { DEFAULT_LOG_STEP } from './logGrid';
import { arbitraryFluxUnit } from './parseFluxUnit';
import type { Spectrum, TemplateClass } from './types';
import { mulberry32 } from './seededRandom';

export interface SyntheticOptions {
  /** Template class; its first recipe of that class is used ('galaxy' → emission-line galaxy). */
  class: TemplateClass;
  z: number;
  /** Signal-to-noise per pixel: of the continuum redward of Lyα for Lyman-break sources, else of the peak feature (amplitude / σ). */
  snr: number;
  seed: number;
  /** Observed range, Å (default 3600–9800) and pixel count (default 4000). */
  wavelengthMin?: number;
  wavelengthMax?: number;
  pixels?: number;
  /** Template id to use instead of the class default. */
  template?: string;
  /** Fraction of pixels masked as bad (default 0.01). */
  maskedFraction?: number;
}

/** Deterministic so tests and demos reproduce exactly. */
const rng = mulberry32;

const DEFAULT_TEMPLATE: Record<TemplateClass, string> = {
  galaxy: 'galaxy-emission',
  quasar: 'quasar',
  star: 'star-cool',
  'lyman-break': 'lyman-break-lya',
};

/**
 * A seeded synthetic spectrum of one template class at redshift z, with Gaussian noise at the
 * requested S/N, sky-line residuals and a few masked pixels; vacuum wavelengths on a log-uniform
 * grid; returns the engine's columnar spectrum.
 * - Lyman-break sources are physical: the template before continuum removal (UV power law × Madau
 *   IGM, Lyα when the template has it), with `snr` the continuum S/N per pixel just redward of Lyα
 *   (rest 1250–1500 Å).
 * - Other classes: the continuum-removed template (sum of its basis vectors, in the IGM bin
 *   containing z) plus a smooth continuum, with `snr` the peak feature amplitude over σ.
 */
export function generateSyntheticSpectrum(options: SyntheticOptions): Spectrum {
  const random = rng(options.seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const step = DEFAULT_LOG_STEP;
  const set = templateSetFor(step, 1, Math.round(0.03 / step) | 1);
  const id = options.template ?? DEFAULT_TEMPLATE[options.class];
  const t = set.templates.find((x) => x.id === id);
  if (!t) throw new RangeError(`No template "${id}".`);
  const bin = t.bins.find((b) => options.z >= b.zLo && options.z <= b.zHi) ?? t.bins[0]!;
  const lo = options.wavelengthMin ?? 3600;
  const hi = options.wavelengthMax ?? 9800;
  const n = options.pixels ?? 4000;
  const wavelength = new Float64Array(n);
  const flux = new Float64Array(n);
  const ivar = new Float64Array(n);
  const mask = new Uint8Array(n);
  const sky = new Float64Array(n);
  const model = new Float64Array(n);
  // Lyman-break sources and quasars are drawn with their template's own continuum (power law, IGM):
  // the continuum-shape check of the scan judges it, so an arbitrary added continuum would be a
  // spectrum no quasar has. Galaxies and stars keep the filtered template on a smooth continuum.
  const physical = t.class === 'lyman-break' || t.class === 'quasar';
  let peak = 0;
  const redContinuum: number[] = [];
  for (let i = 0; i < n; i++) {
    const lam = lo * (hi / lo) ** (i / (n - 1));
    wavelength[i] = lam;
    const restA = lam / (1 + options.z);
    const rest = Math.log10(restA) / step - set.h0;
    const j = Math.floor(rest);
    const f = rest - j;
    let v = 0;
    bin.basis.forEach((b, k) => {
      if (!t.basis[b]!.synthetic) return;
      const arr = physical ? t.basis[b]!.unfiltered : t.basis[b]!.values;
      const val = j >= 0 && j + 1 < arr.length ? arr[j]! * (1 - f) + arr[j + 1]! * f : 0;
      v += val * (k === 0 ? 1 : 0.5);
    });
    model[i] = v;
    peak = Math.max(peak, Math.abs(v));
    if (physical && restA >= 1250 && restA <= 1500) redContinuum.push(v);
  }
  redContinuum.sort((a, b) => a - b);
  const all = Array.from(model, Math.abs).sort((a, b) => a - b);
  // S/N is per pixel on the continuum: redward of Lyα for Lyman-break sources, the median level for quasars.
  const level = t.class === 'lyman-break' ? (redContinuum[redContinuum.length >> 1] ?? peak) : physical ? all[all.length >> 1]! : peak;
  const sigma = level > 0 ? level / options.snr : 1;
  const maskedFraction = options.maskedFraction ?? 0.01;
  for (let i = 0; i < n; i++) {
    const lam = wavelength[i]!;
    const continuum = physical ? 0 : peak * (0.5 + 0.2 * (lam / 6000));
    // Sky residuals: imperfectly subtracted night-sky lines inflate the noise where they sit.
    const skyLine = [5578.9, 6302.0, 7246.0, 7916.0, 8399.0, 8827.0, 9378.0].some((s) => Math.abs(lam - s) < 3) ? 4 : 1;
    sky[i] = skyLine > 1 ? 20 * peak : peak;
    const s = sigma * skyLine;
    flux[i] = continuum + model[i]! + s * gauss();
    ivar[i] = 1 / (s * s);
    if (random() < maskedFraction) {
      mask[i] = 1;
      ivar[i] = 0;
      flux[i] = 1e4 * peak;
    }
  }
  return {
    wavelength, flux, ivar, mask, sky,
    fluxUnit: arbitraryFluxUnit(),
    meta: { source: `synthetic ${id} z=${options.z} S/N=${options.snr} seed=${options.seed}`, medium: 'vacuum', mediumFrom: 'header', errorsEstimated: false, columns: {}, warnings: [] },
  };
}
