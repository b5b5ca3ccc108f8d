import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { FilterCurve } from '../../backend/src/photoz/filterCurve';
import { calzettiTransmission } from '../../backend/src/photoz/dust';
import { photoZIgm } from '../../backend/src/photoz/igm';
import { bandAverageFnu, effectiveWavelength, nJyFromAb } from '../../backend/src/photoz/photometry';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';
import { gaussianFrom, mulberry32 } from '../../backend/src/spectra/seededRandom';

/**
 * A mock photometric catalogue for the held-out check, built on purpose from SEDs the fit does not
 * use: the Shapley et al. (2003, ApJ 588, 65) z ≈ 3 LBG composite (real, with its own Lyα and
 * interstellar lines; its built-in z ≈ 3 forest divided out, see compositeForest) continued by a power law of random β, a Balmer break and rest-optical
 * emission lines; the Kinney et al. (1996) bulge and Sc composites and the Calzetti et al. (1994)
 * starburst composites with random Calzetti (2000) dust as 4000 Å-break interlopers; sources
 * with a flat f_ν. The IGM is the engine's mean transmission raised to a random power per
 * sightline (0.7…1.3: the scatter between sightlines). Photometry goes through each curve's own
 * samples (bandAverageFnu), not the fit's resampled bands.
 */
export interface MockSource {
  id: string;
  kind: 'lbg' | 'interloper' | 'flat';
  z: number;
  flux: number[];
  err: number[];
  /** What the mock drew (for diagnosis only; the draws do not depend on it). */
  drawn?: { composite?: string; ebv?: number; mag?: number; beta?: number };
}

/** Ten HST + Spitzer bands and 5σ point-source depths (AB) of a deep legacy field (common practice, from memory). */
export const MOCK_BANDS: Array<[string, number]> = [
  ['acs_wfc_f435w', 28.7], ['acs_wfc_f606w', 29.0], ['acs_wfc_f775w', 28.5], ['acs_wfc_f850lp', 28.2],
  ['wfc3_ir_f105w', 28.3], ['wfc3_ir_f125w', 28.4], ['wfc3_ir_f140w', 28.0], ['wfc3_ir_f160w', 28.3],
  ['spitzer_irac_ch1', 26.2], ['spitzer_irac_ch2', 26.0],
];

/** Deterministic uniform and normal deviates (mulberry32; Box–Muller). */
function rng(seed: number) {
  const u = mulberry32(seed);
  const n = gaussianFrom(u);
  return { u, n, range: (lo: number, hi: number) => lo + (hi - lo) * u() };
}

/** The mock's own rest grid: ln λ steps of 0.001 from 500 Å to 6 µm. */
const REST = Float64Array.from({ length: Math.ceil(Math.log(60000 / 500) / 0.001) + 1 }, (_, i) => 500 * Math.exp(0.001 * i));

function interp(x: Float64Array | number[], y: Float64Array | number[], at: number): number {
  let lo = 0;
  let hi = x.length - 1;
  if (at < x[0]! || at > x[hi]!) return NaN;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (x[mid]! <= at) lo = mid;
    else hi = mid;
  }
  return y[lo]! + ((y[hi]! - y[lo]!) * (at - x[lo]!)) / (x[hi]! - x[lo]! || 1);
}

/** Median of f over [lo, hi] Å of a spectrum (robust level for joins). */
function levelAt(x: ArrayLike<number>, y: ArrayLike<number>, lo: number, hi: number): number {
  const v: number[] = [];
  for (let i = 0; i < x.length; i++) if (x[i]! >= lo && x[i]! <= hi && Number.isFinite(y[i]!)) v.push(y[i]!);
  v.sort((a, b) => a - b);
  return v[v.length >> 1]!;
}

function gaussianLine(fnu: Float64Array, centreA: number, fluxNu: number, sigmaA = 5) {
  for (let i = 0; i < REST.length; i++) {
    const d = (REST[i]! - centreA) / sigmaA;
    if (Math.abs(d) < 6) fnu[i]! += (fluxNu * Math.exp(-0.5 * d * d)) / (sigmaA * Math.sqrt(2 * Math.PI));
  }
}

export function generateMockCatalogue(shared: string, curves: FilterCurve[], counts = { lbg: 1500, interloper: 800, flat: 300 }, seed = 4242): MockSource[] {
  const r = rng(seed);
  // Shapley LBG composite: rest Å and f_ν-like flux (MANIFEST.tsv).
  const shapley = readFileSync(join(shared, 'composites', 'Shapley2003_LBG_composite.txt'), 'utf8').trim().split('\n').map((l) => l.trim().split(/\s+/).map(Number));
  const sx = shapley.map((p) => p[0]!);
  const sy = shapley.map((p) => p[1]!);
  const sLevel = levelAt(sx, sy, 1850, 2000);
  const read = (f: string) => {
    const s = readSpectrum(new Uint8Array(readFileSync(join(shared, 'composites', f))));
    return { x: s.wavelength, y: Float64Array.from(s.flux, (v, i) => (s.mask[i] ? NaN : (v * s.wavelength[i]! * s.wavelength[i]!))) };
  };
  const lowzFiles = ['KC96_bulge_template.fits', 'KC96_sc_template.fits', 'KC96_starb4_template.fits', 'KC96_starb5_template.fits', 'KC96_starb6_template.fits'];
  const lowz = lowzFiles.map(read);
  const out: MockSource[] = [];
  const depthSigma = MOCK_BANDS.map(([, m5]) => nJyFromAb(m5) / 5);

  const observe = (id: string, kind: MockSource['kind'], z: number, fnuRest: Float64Array, igmPower: number, normBand: number, mag: number) => {
    const lamObs = Float64Array.from(REST, (l) => l * (1 + z));
    const fnu = Float64Array.from(fnuRest, (v, i) => (kind === 'flat' ? v : v * Math.pow(photoZIgm(lamObs[i]!, z), igmPower)));
    const model = curves.map((c) => bandAverageFnu(c, lamObs, fnu).fnu);
    const scale = nJyFromAb(mag) / model[normBand]!;
    const flux: number[] = [];
    const err: number[] = [];
    model.forEach((m, b) => {
      const truth = m * scale * (1 + 0.02 * r.n()); // 2 % calibration scatter per band
      const sigma = depthSigma[b]!;
      flux.push(Number((truth + sigma * r.n()).toPrecision(6)));
      err.push(Number(sigma.toPrecision(4)));
    });
    out.push({ id, kind, z, flux, err, drawn: { mag } });
  };

  for (let k = 0; k < counts.lbg; k++) {
    const z = r.range(3, 9.5);
    const beta = Math.min(-1.2, Math.max(-2.8, -2.0 + 0.35 * r.n()));
    const balmer = r.range(1.0, 1.8); // f_ν jump at 3646 Å
    const ewOiii = r.range(0, 500);
    const ewHa = r.range(0, 400);
    const fnu = new Float64Array(REST.length);
    for (let i = 0; i < REST.length; i++) {
      const l = REST[i]!;
      if (l < 912) continue;
      if (l <= 2000) fnu[i] = Math.max(0, interp(sx, sy, Math.max(920, l)) / sLevel) / compositeForest(l);
      else {
        fnu[i] = Math.pow(l / 2000, beta + 2);
        if (l > 3646) fnu[i]! *= balmer;
      }
    }
    const cont = (l: number) => interp(REST, fnu, l);
    // Rest EW in Å → line flux in f_ν·Hz terms: EW·c/λ² · f_ν, spread as a Gaussian in λ (flux per Å in f_ν units).
    gaussianLine(fnu, 5008, ewOiii * 0.7 * cont(5008));
    gaussianLine(fnu, 4862, ewOiii * 0.3 * cont(4862));
    gaussianLine(fnu, 6564, ewHa * cont(6564));
    // Normalise in the band holding rest 1600 Å, observed AB 25.0 … 27.8.
    const lam1600 = 1600 * (1 + z);
    const normBand = nearestBand(curves, lam1600);
    observe(`lbg-${k}`, 'lbg', z, fnu, r.range(0.7, 1.3), normBand, r.range(25.0, 27.8));
  }
  for (let k = 0; k < counts.interloper; k++) {
    const z = r.range(0.5, 2.5);
    const t = Math.floor(r.u() * lowz.length);
    const s = lowz[t]!;
    const ebv = t === 0 ? r.range(0, 0.5) : r.range(0, 0.8);
    // The mock's own continuation: f_ν power law fitted to the last 1000 Å, to 1.6 µm, then f_ν ∝ λ⁻² (Rayleigh–Jeans).
    const last = s.x[s.x.length - 1]!;
    const first = s.x[0]!;
    const a = levelAt(s.x, s.y, last - 1000, last - 500);
    const b = levelAt(s.x, s.y, last - 500, last);
    const alpha = Math.log(b / a) / Math.log((last - 250) / (last - 750));
    const f16 = b * Math.pow(16000 / (last - 250), alpha);
    const fnu = new Float64Array(REST.length);
    for (let i = 0; i < REST.length; i++) {
      const l = REST[i]!;
      let v: number;
      if (l < 912) v = 0;
      else if (l < first) v = levelAt(s.x, s.y, first, first + 100) * Math.pow(l / first, 2); // faint far-UV, f_ν ∝ λ²
      else if (l <= last) v = interp(s.x, s.y, l);
      else if (l <= 16000) v = b * Math.pow(l / (last - 250), alpha);
      else v = f16 * Math.pow(l / 16000, -2);
      fnu[i] = Math.max(0, Number.isFinite(v) ? v : 0) * calzettiTransmission(l, ebv);
    }
    observe(`lowz-${k}`, 'interloper', z, fnu, 1, 7, r.range(22.5, 26.5));
    Object.assign(out[out.length - 1]!.drawn!, { composite: lowzFiles[t]!.replace(/_template\.fits$/, ''), ebv });
  }
  for (let k = 0; k < counts.flat; k++) {
    observe(`flat-${k}`, 'flat', 0, new Float64Array(REST.length).fill(1), 0, 7, r.range(24, 28));
  }
  return out;
}

/**
 * Mean redshift of the Shapley et al. (2003) composite's galaxies (z ≈ 3: the paper's title
 * sample; ⟨z⟩ = 2.96 from memory). The composite was stacked from observed spectra without an IGM
 * correction, so blueward of Lyα it already carries the mean z ≈ 3 forest (measured on the file:
 * 1030–1180 Å sits at 0.63–0.66 of the 1260–1500 Å continuum carried down by its own slope).
 */
const SHAPLEY_MEAN_Z = 2.96;

/**
 * The forest already in the composite at rest λ (Å): the same mean transmission the mock applies
 * afterwards, taken at the composite's mean redshift. Dividing by it returns the composite to its
 * unabsorbed shape (stellar and interstellar features kept), so each mock sightline's own IGM is
 * applied once, not on top of z ≈ 3's. ≥ 0.6 over 920–1216 Å at z = 2.96, so noise is not blown up.
 */
function compositeForest(restA: number): number {
  if (restA >= 1215.67) return 1;
  return photoZIgm(restA * (1 + SHAPLEY_MEAN_Z), SHAPLEY_MEAN_Z);
}

function nearestBand(curves: FilterCurve[], lam: number): number {
  let best = 0;
  let d = Infinity;
  curves.forEach((c, b) => {
    const mid = effectiveWavelength(c);
    const e = Math.abs(Math.log(mid / lam));
    if (e < d) { d = e; best = b; }
  });
  return best;
}
