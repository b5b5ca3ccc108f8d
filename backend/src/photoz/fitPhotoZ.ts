import type { ModelGrid } from './modelGrid';
import { interiorPairReduction, solveNonNegativePair } from './nonNegativePair';
import type { PhotoZClass } from './restTemplates';

export interface FitOptions {
  /**
   * Fraction of each measured flux added in quadrature to its error: calibration and template
   * mismatch that the catalogue's errors do not carry (3 %; common practice, our choice).
   */
  errorFloor: number;
  /** Model error, as a fraction of the model flux, of a star in a band its real spectrum does not cover (30 %, our choice: the tail is a guess). */
  extrapolatedFloor: number;
  /**
   * Multiplies the grid's template error function (templateError.ts) before it is added in
   * quadrature, as a fraction of each measured flux, per band and trial redshift (1; 0 turns it off).
   */
  templateErrorScale: number;
  /**
   * Prior on z: 'volume' (the comoving volume per unit z, priors.ts; the default) or 'flat' (none).
   */
  prior: 'volume' | 'flat';
  /**
   * The break rule: a source is placed beyond `lowZ` on a Lyman-break template only when that solution beats the
   * best one below `lowZ` by at least this Δ(χ² − 2 ln prior); otherwise the best z is the low-z
   * solution (4: the Lyman break detected at ≈ 2σ; 0 turns the rule off). See fitPhotoZ.
   */
  breakDeltaChi2: number;
  /** Redshift below which a galaxy counts as a low-z interloper for pLowZ. */
  lowZ: number;
  /** Also return P(z) on the grid nodes (normalised to unit mass). */
  withPosterior: boolean;
  /** Also return χ²(z), the best template's index per node (pairs after the single templates) and Σ ln σ²(z) (diagnosis). */
  withProfile: boolean;
  /** Try the grid's two-template non-negative sums (templatePairs.ts) as well as single templates (true). */
  pairs: boolean;
}

export const DEFAULT_FIT_OPTIONS: FitOptions = { errorFloor: 0.03, extrapolatedFloor: 0.3, templateErrorScale: 1, prior: 'volume', breakDeltaChi2: 4, lowZ: 2, withPosterior: false, withProfile: false, pairs: true };

/** One source's photometric redshift. χ² values are with the floored errors. */
export interface PhotoZFit {
  /** Best z: the minimum of χ²(z) (the posterior mode under the flat prior), refined between grid nodes. */
  z: number;
  /** Equal-tail intervals of P(z): 16–84 % and 2.5–97.5 % of the probability. */
  z68: [number, number];
  z95: [number, number];
  /** P(z < lowZ), the interloper odds. */
  pLowZ: number;
  class: PhotoZClass;
  starChi2: number;
  galaxyChi2: number;
  /** Best galaxy template at z (of a two-template sum, the one giving more of the model's band flux), best star template. */
  galaxyTemplate: string;
  /** When the best galaxy model is a two-template sum: both templates and their shares of the model's summed band flux. */
  galaxyMix?: { templates: [string, string]; shares: [number, number] };
  starTemplate: string | null;
  /** Bands that carried a measurement (finite flux and positive error). */
  bands: number;
  posterior?: Float64Array;
  /** With withProfile: χ²(z) on the grid nodes, the best model per node (< galaxyIds.length a template, else nt + pair) and Σ ln σ² per node. */
  profile?: { chi2: Float64Array; best: Int32Array; lnDet: Float64Array };
}

/** Reusable per-thread buffers, so a catalogue fit allocates nothing per source. */
export interface FitScratch {
  /** Weights and weighted fluxes per (redshift, band): the template error makes them depend on z. */
  w: Float64Array;
  wf: Float64Array;
  /** Σ w F² per redshift. */
  chi0: Float64Array;
  /** Σ ln σ² over the measured bands, per redshift. */
  lnDet: Float64Array;
  profile: Float64Array;
  /** χ²(z) − 2 ln prior(z). */
  post: Float64Array;
  bestT: Int32Array;
  mass: Float64Array;
  /** Σ w F M and Σ w M² per (template, redshift): the single fits' sums, reused by the pairs. */
  num: Float64Array;
  den: Float64Array;
}

export function fitScratch(grid: ModelGrid): FitScratch {
  const nz = grid.redshift.z.length;
  const nb = grid.bands.length;
  return { w: new Float64Array(nz * nb), wf: new Float64Array(nz * nb), chi0: new Float64Array(nz), lnDet: new Float64Array(nz), profile: new Float64Array(nz), post: new Float64Array(nz), bestT: new Int32Array(nz), mass: new Float64Array(nz), num: new Float64Array(grid.galaxyIds.length * nz), den: new Float64Array(grid.galaxyIds.length * nz) };
}

/**
 * Fits one source: for every galaxy template and grid redshift the best non-negative amplitude
 * a = max(0, Σ w F M / Σ w M²) (analytic, one template at a time), then for the grid's template
 * pairs below their maxZ the best two non-negative amplitudes (nonNegativePair.ts), χ²(z) = min
 * over templates and pairs,
 * P(z) ∝ exp(−χ²(z)/2) under a flat prior in z; stars at z = 0 the same way. Non-detections
 * (zero or negative flux with an error) are measurements like any other; a band with a NaN flux
 * or a non-positive error carries no weight (not observed).
 *
 * @param flux band fluxes in the grid's band order (any unit, the same as err)
 * @param err 1σ errors
 */
export function fitPhotoZ(grid: ModelGrid, flux: ArrayLike<number>, err: ArrayLike<number>, options: Partial<FitOptions> = {}, scratch: FitScratch = fitScratch(grid)): PhotoZFit {
  const opt = { ...DEFAULT_FIT_OPTIONS, ...options };
  const nb = grid.bands.length;
  const { z, edges } = grid.redshift;
  const nz = z.length;
  const { w, wf, chi0, lnDet, profile, post, bestT, mass, num: tNum, den: tDen } = scratch;
  const te = grid.templateError;
  const teScale = opt.templateErrorScale;
  let bands = 0;
  for (let b = 0; b < nb; b++) {
    const f = flux[b]!;
    const e = err[b]!;
    if (Number.isFinite(f) && e > 0 && Number.isFinite(e)) bands++;
  }
  chi0.fill(0);
  lnDet.fill(0);
  for (let k = 0; k < nz; k++) {
    for (let b = 0; b < nb; b++) {
      const i = k * nb + b;
      const f = flux[b]!;
      const e = err[b]!;
      if (Number.isFinite(f) && e > 0 && Number.isFinite(e)) {
        // Calibration floor and template error, both as fractions of the measured flux (so the
        // amplitude stays linear); a negative flux (a non-detection, whose model is ≈ 0) gets no
        // template error.
        const floor = opt.errorFloor * f;
        const model = f > 0 ? teScale * te[i]! * f : 0;
        w[i] = 1 / (e * e + floor * floor + model * model);
        wf[i] = w[i]! * f;
        chi0[k]! += wf[i]! * f;
        lnDet[k]! -= Math.log(w[i]!);
      } else {
        w[i] = 0;
        wf[i] = 0;
      }
    }
  }

  // Galaxies: the tight loop (templates × redshifts × bands), walking the grid in memory order.
  profile.fill(Infinity);
  const m = grid.galaxy;
  const m2 = grid.galaxySquared;
  const nt = grid.galaxyIds.length;
  let o = 0;
  for (let t = 0; t < nt; t++) {
    for (let k = 0, i = 0; k < nz; k++) {
      let num = 0;
      let den = 0;
      for (let b = 0; b < nb; b++, o++, i++) {
        num += wf[i]! * m[o]!;
        den += w[i]! * m2[o]!;
      }
      tNum[t * nz + k] = num;
      tDen[t * nz + k] = den;
      // Amplitude num/den clipped at 0: a template that can only fit with negative flux is the zero model.
      let chi = num > 0 ? chi0[k]! - (num * num) / den : chi0[k]!;
      if (chi < 0) chi = 0;
      if (chi < profile[k]!) {
        profile[k] = chi;
        bestT[k] = t;
      }
    }
  }
  // Two-template sums: only the interior solutions (both amplitudes > 0) can beat the single fits
  // above, whose sums they reuse; one more dot product per (pair, z) for the cross term.
  const np = opt.pairs ? grid.pairs.length / 2 : 0;
  const pz = grid.pairNz;
  const cross = grid.pairProduct;
  for (let p = 0, o = 0; p < np; p++) {
    const a = grid.pairs[2 * p]! * nz;
    const c = grid.pairs[2 * p + 1]! * nz;
    for (let k = 0, i = 0; k < pz; k++) {
      let cr = 0;
      for (let b = 0; b < nb; b++, o++, i++) cr += w[i]! * cross[o]!;
      const red = interiorPairReduction(tNum[a + k]!, tNum[c + k]!, tDen[a + k]!, tDen[c + k]!, cr);
      if (red > 0) {
        let chi = chi0[k]! - red;
        if (chi < 0) chi = 0;
        if (chi < profile[k]!) {
          profile[k] = chi;
          bestT[k] = nt + p;
        }
      }
    }
  }
  let kChi = 0;
  for (let k = 1; k < nz; k++) if (profile[k]! < profile[kChi]!) kChi = k;
  const galaxyChi2 = profile[kChi]!;
  // The posterior's −2 ln: χ²(z) − 2 ln π(z). Its minimum is the best z.
  const lnPrior = opt.prior === 'volume' ? grid.lnVolumePrior : null;
  // The template error makes the errors depend on z, so the likelihood's normalisation
  // Σ ln σ² (lnDet) changes with z too and belongs in the posterior: without it, a z where the
  // template error inflates a band's error would win by being forgiving, not by fitting.
  for (let k = 0; k < nz; k++) post[k] = profile[k]! + lnDet[k]! - lnDet[0]! - (lnPrior ? 2 * lnPrior[k]! : 0);
  let kMin = 0;
  for (let k = 1; k < nz; k++) if (post[k]! < post[kMin]!) kMin = k;
  const postMin = post[kMin]!;
  // The break rule. Beyond z ≈ 2 a galaxy's redshift rests on its Lyman break; a source whose
  // blue bands are not measurably fainter than a low-z solution predicts (a flat f_ν, a noisy
  // interloper) has no detected break, and calling it a dropout would be reading noise. So the
  // best z goes beyond lowZ on a Lyman-break template only if the best low-z solution is worse by
  // breakDeltaChi2 (a 4000 Å-break galaxy at z > 2 rests on its own break and is left alone); P(z),
  // its intervals and pLowZ are left as they are (they already carry the ambiguity).
  let kBest = kMin;
  if (opt.breakDeltaChi2 > 0 && z[kMin]! >= opt.lowZ && bestT[kMin]! < nt && grid.galaxyKinds[bestT[kMin]!] === 'lyman-break') {
    let kLow = -1;
    for (let k = 0; k < nz && z[k]! < opt.lowZ; k++) if (kLow < 0 || post[k]! < post[kLow]!) kLow = k;
    if (kLow >= 0 && post[kLow]! - postMin < opt.breakDeltaChi2) kBest = kLow;
  }

  // P(z) as mass per grid cell, then equal-tail intervals from its cumulative sum.
  let total = 0;
  let low = 0;
  for (let k = 0; k < nz; k++) {
    const width = edges[k + 1]! - edges[k]!;
    const p = Math.exp(-0.5 * (post[k]! - postMin)) * width;
    mass[k] = p;
    total += p;
    if (edges[k + 1]! <= opt.lowZ) low += p;
    else if (edges[k]! < opt.lowZ) low += (p * (opt.lowZ - edges[k]!)) / width;
  }
  const quantile = (q: number): number => {
    const target = q * total;
    let cum = 0;
    for (let k = 0; k < nz; k++) {
      const next = cum + mass[k]!;
      if (next >= target && mass[k]! > 0) return edges[k]! + ((edges[k + 1]! - edges[k]!) * (target - cum)) / mass[k]!;
      cum = next;
    }
    return edges[nz]!;
  };

  // Stars: z = 0. In a band mostly off a star's real spectrum the model is a guess (the
  // Rayleigh–Jeans tail), so it carries a model error of `extrapolatedFloor` × the model flux:
  // the amplitude is first fitted on the other bands, the model error follows from it, then the
  // star is fitted on all bands. A model error scaled by the data instead would make the zero
  // model of a star fit better than the zero model of a galaxy. Stars use the weights of the
  // z = 0 row (the first nb entries of w), so a star and a galaxy at z = 0 see the same errors.
  let starChi2 = Infinity;
  let starBest = -1;
  const ns = grid.starIds.length;
  for (let t = 0; t < ns; t++) {
    const o = t * nb;
    let cFM = 0;
    let cMM = 0;
    for (let b = 0; b < nb; b++) {
      if (grid.starExtrapolated[o + b]) continue;
      const mm = grid.star[o + b]!;
      cFM += wf[b]! * mm;
      cMM += w[b]! * mm * mm;
    }
    const a0 = cFM > 0 && cMM > 0 ? cFM / cMM : 0;
    let sFF = 0;
    let sFM = 0;
    let sMM = 0;
    for (let b = 0; b < nb; b++) {
      if (w[b] === 0) continue;
      const mm = grid.star[o + b]!;
      let ww = w[b]!;
      if (grid.starExtrapolated[o + b]) {
        const modelErr = opt.extrapolatedFloor * a0 * mm;
        ww = 1 / (1 / ww + modelErr * modelErr);
      }
      const f = flux[b]!;
      sFF += ww * f * f;
      sFM += ww * f * mm;
      sMM += ww * mm * mm;
    }
    const chi = sFM > 0 && sMM > 0 ? Math.max(0, sFF - (sFM * sFM) / sMM) : sFF;
    if (chi < starChi2) {
      starChi2 = chi;
      starBest = t;
    }
  }

  const mix = bestT[kBest]! >= nt ? pairMix(grid, bestT[kBest]! - nt, kBest, w, tNum, tDen) : undefined;
  const result: PhotoZFit = {
    z: refineMinimum(post, z, kBest),
    z68: [quantile(0.16), quantile(0.84)],
    z95: [quantile(0.025), quantile(0.975)],
    pLowZ: total > 0 ? low / total : NaN,
    // A tie goes to the star: it has one free parameter where the galaxy has two (amplitude and z).
    class: starChi2 <= galaxyChi2 ? 'star' : 'galaxy',
    starChi2,
    galaxyChi2,
    galaxyTemplate: mix ? mix.templates[mix.shares[0] >= mix.shares[1] ? 0 : 1] : grid.galaxyIds[bestT[kBest]!]!,
    starTemplate: starBest >= 0 ? grid.starIds[starBest]! : null,
    bands,
  };
  if (mix) result.galaxyMix = mix;
  if (opt.withProfile) result.profile = { chi2: Float64Array.from(profile), best: Int32Array.from(bestT), lnDet: Float64Array.from(lnDet) };
  if (opt.withPosterior) result.posterior = Float64Array.from(mass, (p, k) => p / total / (edges[k + 1]! - edges[k]!));
  return result;
}

/** Pair p's two templates at node k and their shares of the fitted model's summed band flux. */
function pairMix(grid: ModelGrid, p: number, k: number, w: Float64Array, tNum: Float64Array, tDen: Float64Array): NonNullable<PhotoZFit['galaxyMix']> {
  const nb = grid.bands.length;
  const nz = grid.redshift.z.length;
  const ta = grid.pairs[2 * p]!;
  const tb = grid.pairs[2 * p + 1]!;
  let cr = 0;
  let fa = 0;
  let fb = 0;
  for (let b = 0; b < nb; b++) {
    cr += w[k * nb + b]! * grid.pairProduct[(p * grid.pairNz + k) * nb + b]!;
    fa += grid.galaxy[(ta * nz + k) * nb + b]!;
    fb += grid.galaxy[(tb * nz + k) * nb + b]!;
  }
  const s = solveNonNegativePair(tNum[ta * nz + k]!, tNum[tb * nz + k]!, tDen[ta * nz + k]!, tDen[tb * nz + k]!, cr);
  const total = s.a1 * fa + s.a2 * fb;
  return { templates: [grid.galaxyIds[ta]!, grid.galaxyIds[tb]!], shares: total > 0 ? [(s.a1 * fa) / total, (s.a2 * fb) / total] : [0.5, 0.5] };
}

/** The χ² minimum between nodes: a parabola through the node and its neighbours, in ln(1 + z), moved at most half a step. */
function refineMinimum(profile: Float64Array, z: Float64Array, k: number): number {
  if (k === 0 || k === z.length - 1) return z[k]!;
  const a = profile[k - 1]!;
  const b = profile[k]!;
  const c = profile[k + 1]!;
  const curv = a - 2 * b + c;
  if (!(curv > 0)) return z[k]!;
  const d = Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / curv));
  const u = Math.log1p(z[k]!) + d * (Math.log1p(z[k + 1]!) - Math.log1p(z[k]!));
  return Math.expm1(u);
}

/** A catalogue's fits as columns (compact to move between threads). Template columns index the grid's id lists. */
export interface PhotoZColumns {
  z: Float64Array;
  z68: Float64Array;
  z95: Float64Array;
  pLowZ: Float64Array;
  starChi2: Float64Array;
  galaxyChi2: Float64Array;
  isStar: Uint8Array;
  galaxyTemplate: Int16Array;
  starTemplate: Int16Array;
  bands: Uint8Array;
}

/**
 * Fits `n` sources whose fluxes and errors are row-major (`n × bands`, the grid's band order).
 * z68 and z95 hold [lo, hi] pairs per source.
 */
export function fitCatalogue(grid: ModelGrid, flux: Float64Array, err: Float64Array, n: number, options: Partial<FitOptions> = {}): PhotoZColumns {
  const nb = grid.bands.length;
  if (flux.length !== n * nb || err.length !== n * nb) throw new RangeError(`expected ${n} × ${nb} fluxes and errors`);
  const out: PhotoZColumns = {
    z: new Float64Array(n), z68: new Float64Array(2 * n), z95: new Float64Array(2 * n), pLowZ: new Float64Array(n),
    starChi2: new Float64Array(n), galaxyChi2: new Float64Array(n), isStar: new Uint8Array(n),
    galaxyTemplate: new Int16Array(n), starTemplate: new Int16Array(n), bands: new Uint8Array(n),
  };
  const scratch = fitScratch(grid);
  const opt = { ...options, withPosterior: false, withProfile: false };
  for (let i = 0; i < n; i++) {
    const r = fitPhotoZ(grid, flux.subarray(i * nb, (i + 1) * nb), err.subarray(i * nb, (i + 1) * nb), opt, scratch);
    out.z[i] = r.z;
    out.z68[2 * i] = r.z68[0];
    out.z68[2 * i + 1] = r.z68[1];
    out.z95[2 * i] = r.z95[0];
    out.z95[2 * i + 1] = r.z95[1];
    out.pLowZ[i] = r.pLowZ;
    out.starChi2[i] = r.starChi2;
    out.galaxyChi2[i] = r.galaxyChi2;
    out.isStar[i] = r.class === 'star' ? 1 : 0;
    out.galaxyTemplate[i] = grid.galaxyIds.indexOf(r.galaxyTemplate);
    out.starTemplate[i] = r.starTemplate === null ? -1 : grid.starIds.indexOf(r.starTemplate);
    out.bands[i] = r.bands;
  }
  return out;
}
