import type { FilterCurve } from './filterCurve';
import { photoZIgm } from './igm';
import { bandSampler, type BandSampler } from './photometry';
import type { TemplateSet } from './analyticTemplates';
import { templateErrorFraction } from './templateError';
import { lnVolumePrior } from './priors';
import { DEFAULT_TEMPLATE_PAIRS, type TemplatePairs } from './templatePairs';

/** Redshifts of the fit: uniform in ln(1 + z), so Δz/(1 + z) is the same everywhere. */
export interface RedshiftGrid {
  z: Float64Array;
  /** Cell edges (length z.length + 1) for turning P(z) at the nodes into probability mass. */
  edges: Float64Array;
  /** Step in ln(1 + z). */
  dlnOnePlusZ: number;
}

/**
 * 0 ≤ z ≤ zMax with Δln(1 + z) ≈ `step`: 0.006 gives 429 nodes to z = 12, Δz = 0.006 at z = 0,
 * 0.024 at z = 3, 0.06 at z = 9 — under a sixth of the 0.04·(1 + z) scatter broad-band dropouts
 * reach, and the best z is refined between nodes, so the grid does not limit the answer. The
 * fit's cost is proportional to the node count.
 */
export function redshiftGrid(zMax = 12, step = 0.006): RedshiftGrid {
  const n = Math.ceil(Math.log1p(zMax) / step) + 1;
  const du = Math.log1p(zMax) / (n - 1);
  const z = new Float64Array(n);
  for (let i = 0; i < n; i++) z[i] = Math.expm1(i * du);
  z[n - 1] = zMax;
  const edges = new Float64Array(n + 1);
  edges[0] = 0;
  for (let i = 1; i < n; i++) edges[i] = 0.5 * (z[i - 1]! + z[i]!);
  edges[n] = zMax;
  return { z, edges, dlnOnePlusZ: du };
}

/**
 * Every template's band fluxes at every redshift, for one filter set: the fit is then a loop over
 * precomputed numbers. Galaxy models are `galaxy[(t·nZ + k)·nBands + b]`, ⟨f_ν⟩ through band b of
 * template t at z_k with the mean IGM applied (arbitrary scale per template); stars are at z = 0.
 */
export interface ModelGrid {
  bands: string[];
  redshift: RedshiftGrid;
  galaxyIds: string[];
  galaxyKinds: string[];
  galaxy: Float64Array;
  /** galaxy² elementwise (saves a multiply in the fit's inner loop). */
  galaxySquared: Float64Array;
  starIds: string[];
  star: Float64Array;
  /**
   * 1 where less than half of band b's weight ∫T dλ/λ falls on star t's measured spectrum, so the
   * model there is the stated extension (Rayleigh–Jeans tail or nothing) rather than data.
   */
  starExtrapolated: Uint8Array;
  /**
   * The template error of band b at z_k, `templateError[k·nBands + b]`: the fractional error of
   * templateErrorFraction read at the band's rest wavelengths, averaged in quadrature over the
   * band's weight. Row k = 0 (z = 0) is the stars' too.
   */
  templateError: Float64Array;
  /** ln of the comoving-volume prior at each z node (priors.ts), peak 0. */
  lnVolumePrior: Float64Array;
  /**
   * Two-template fits (templatePairs.ts): galaxy indices (first, second) of pair p at
   * `pairs[2p]`, `pairs[2p + 1]`; fitted on the first `pairNz` redshift nodes only.
   */
  pairs: Int16Array;
  pairNz: number;
  /** M_first · M_second per pair, node and band, `pairProduct[(p·pairNz + k)·nBands + b]` (the cross term of the 2 × 2 solve). */
  pairProduct: Float64Array;
}

/** Builds the model grid. Costs ≈ (bands × samples per band × redshifts) IGM evaluations once. */
export function buildModelGrid(set: TemplateSet, bands: FilterCurve[], redshift: RedshiftGrid = redshiftGrid(), pairing: TemplatePairs = DEFAULT_TEMPLATE_PAIRS): ModelGrid {
  if (bands.length === 0) throw new RangeError('a photometric fit needs at least one band');
  const samplers = bands.map((b) => bandSampler(b));
  const galaxies = set.templates.filter((t) => t.class === 'galaxy');
  const stars = set.templates.filter((t) => t.class === 'star');
  const nb = bands.length;
  const nz = redshift.z.length;
  const galaxy = new Float64Array(galaxies.length * nz * nb);
  const { lnMin, dln, n } = set.grid;
  const lnObs = samplers.map((s) => Float64Array.from(s.wavelength, Math.log));
  const igm = samplers.map((s) => new Float64Array(s.wavelength.length));
  const templateError = new Float64Array(nz * nb);
  for (let k = 0; k < nz; k++) {
    const z = redshift.z[k]!;
    const lnShift = Math.log1p(z);
    for (let b = 0; b < nb; b++) {
      const s = samplers[b]!;
      let v = 0;
      for (let i = 0; i < s.wavelength.length; i++) v += s.weight[i]! * templateErrorFraction(s.wavelength[i]! / (1 + z)) ** 2;
      templateError[k * nb + b] = Math.sqrt(v);
    }
    for (let b = 0; b < nb; b++) {
      const s = samplers[b]!;
      // Only Lyman-series and continuum absorption: redward of Lyα at the source nothing is absorbed
      // in any mean-IGM model, so the (costly) model is asked only blueward of it.
      const lyaObs = 1215.67 * (1 + z);
      for (let i = 0; i < s.wavelength.length; i++) igm[b]![i] = s.wavelength[i]! > lyaObs ? 1 : photoZIgm(s.wavelength[i]!, z);
    }
    for (let t = 0; t < galaxies.length; t++) {
      const f = galaxies[t]!.fnu;
      for (let b = 0; b < nb; b++) {
        galaxy[(t * nz + k) * nb + b] = bandThrough(samplers[b]!, lnObs[b]!, igm[b]!, f, lnMin + lnShift, dln, n);
      }
    }
  }
  const galaxySquared = Float64Array.from(galaxy, (v) => v * v);
  const star = new Float64Array(stars.length * nb);
  const starExtrapolated = new Uint8Array(stars.length * nb);
  for (let t = 0; t < stars.length; t++) {
    const st = stars[t]!;
    for (let b = 0; b < nb; b++) {
      const s = samplers[b]!;
      star[t * nb + b] = bandThrough(s, lnObs[b]!, null, st.fnu, lnMin, dln, n);
      let inside = 0;
      for (let i = 0; i < s.wavelength.length; i++) if (s.wavelength[i]! >= st.coverage[0] && s.wavelength[i]! <= st.coverage[1]) inside += s.weight[i]!;
      starExtrapolated[t * nb + b] = inside < 0.5 ? 1 : 0;
    }
  }
  // Pairs: every first × second template present in the set (by id prefix), up to pairing.maxZ.
  const pick = (prefixes: string[]) => galaxies.flatMap((t, i) => (prefixes.some((p) => t.id === p || t.id.startsWith(`${p}-`)) ? [i] : []));
  const firsts = pick(pairing.first);
  const seconds = pick(pairing.second).filter((i) => !firsts.includes(i));
  const pairs = Int16Array.from(firsts.flatMap((a) => seconds.flatMap((b) => [a, b])));
  const np = pairs.length / 2;
  let pairNz = 0;
  while (np > 0 && pairNz < nz && redshift.z[pairNz]! <= pairing.maxZ) pairNz++;
  const pairProduct = new Float64Array(np * pairNz * nb);
  for (let p = 0; p < np; p++) {
    for (let k = 0; k < pairNz; k++) {
      for (let b = 0; b < nb; b++) pairProduct[(p * pairNz + k) * nb + b] = galaxy[(pairs[2 * p]! * nz + k) * nb + b]! * galaxy[(pairs[2 * p + 1]! * nz + k) * nb + b]!;
    }
  }
  return {
    pairs, pairNz, pairProduct,
    bands: bands.map((b) => b.name), redshift,
    galaxyIds: galaxies.map((t) => t.id), galaxyKinds: galaxies.map((t) => t.kind), galaxy, galaxySquared,
    starIds: stars.map((t) => t.id), star, starExtrapolated, templateError, lnVolumePrior: lnVolumePrior(redshift.z),
  };
}

/** ⟨f_ν⟩ of a rest-frame template seen through one band, the template read at ln λ_obs − ln(1 + z). */
function bandThrough(s: BandSampler, lnObs: Float64Array, igm: Float64Array | null, fnu: Float64Array, lnStart: number, dln: number, n: number): number {
  let sum = 0;
  for (let i = 0; i < lnObs.length; i++) {
    const u = (lnObs[i]! - lnStart) / dln;
    if (u < 0 || u > n - 1) continue;
    const j = Math.min(n - 2, Math.floor(u));
    const f = u - j;
    const v = fnu[j]! * (1 - f) + fnu[j + 1]! * f;
    sum += s.weight[i]! * v * (igm ? igm[i]! : 1);
  }
  return sum;
}
