import { C_KMS } from './physics';

/** Step of the fine observed-frame grid, dex (≈ 13.8 km/s): finer than any instrument drawn. */
export const FINE_STEP = 2e-5;

/**
 * A source's noiseless flux density on a fine log-λ grid of observed vacuum wavelengths; the
 * sources are drawn on it, then blurred by the instrument and integrated into the file's pixels.
 */
export interface FineGrid {
  /** log10 of the first wavelength, Å. */
  log0: number;
  lambda: Float64Array;
  flux: Float64Array;
}

/** A fine grid covering [lo, hi] Å with a margin of 2 % for the instrument blur. */
export function fineGrid(lo: number, hi: number): FineGrid {
  const log0 = Math.log10(lo / 1.02);
  const n = Math.ceil((Math.log10(hi * 1.02) - log0) / FINE_STEP) + 1;
  const lambda = new Float64Array(n);
  for (let i = 0; i < n; i++) lambda[i] = 10 ** (log0 + i * FINE_STEP);
  return { log0, lambda, flux: new Float64Array(n) };
}

function indexRange(g: FineGrid, lo: number, hi: number): [number, number] {
  const a = Math.max(0, Math.floor((Math.log10(Math.max(lo, 1)) - g.log0) / FINE_STEP));
  const b = Math.min(g.lambda.length - 1, Math.ceil((Math.log10(Math.max(hi, 1)) - g.log0) / FINE_STEP));
  return [a, b];
}

/**
 * Adds a Gaussian emission line of integrated flux `flux` (flux density × Å, observed) centred on
 * the observed wavelength `center` with velocity σ `sigmaKms`. `blueSigmaFactor` < 1 makes the
 * blue side narrower (the asymmetric Lyα of star-forming galaxies), keeping the integral.
 */
export function addLine(g: FineGrid, center: number, sigmaKms: number, flux: number, blueSigmaFactor = 1): void {
  const sRed = (center * sigmaKms) / C_KMS;
  const sBlue = sRed * blueSigmaFactor;
  const peak = flux / (Math.sqrt(2 * Math.PI) * 0.5 * (sRed + sBlue));
  const [a, b] = indexRange(g, center - 6 * sBlue, center + 6 * sRed);
  for (let i = a; i <= b; i++) {
    const d = g.lambda[i]! - center;
    const s = d < 0 ? sBlue : sRed;
    g.flux[i]! += peak * Math.exp(-0.5 * (d / s) ** 2);
  }
}

/**
 * Multiplies in a Gaussian absorption line of rest equivalent width `ewRest` (Å; the observed EW
 * is (1 + z) times larger) and velocity σ; the depth is capped at 0.95 by widening the line.
 */
export function absorbLine(g: FineGrid, center: number, sigmaKms: number, ewRest: number, z: number): void {
  let s = (center * sigmaKms) / C_KMS;
  const ew = ewRest * (1 + z);
  let depth = ew / (Math.sqrt(2 * Math.PI) * s);
  if (depth > 0.95) {
    s *= depth / 0.95;
    depth = 0.95;
  }
  const [a, b] = indexRange(g, center - 6 * s, center + 6 * s);
  for (let i = a; i <= b; i++) g.flux[i]! *= 1 - depth * Math.exp(-0.5 * ((g.lambda[i]! - center) / s) ** 2);
}

/** Gaussian blur of constant velocity σ (km/s): on a log grid that is one fixed kernel. */
export function blur(g: FineGrid, sigmaKms: number): void {
  const sPix = sigmaKms / (C_KMS * Math.LN10 * FINE_STEP);
  if (sPix < 0.5) return;
  const half = Math.ceil(4 * sPix);
  const kernel = new Float64Array(2 * half + 1);
  let sum = 0;
  for (let k = -half; k <= half; k++) sum += kernel[k + half] = Math.exp(-0.5 * (k / sPix) ** 2);
  for (let k = 0; k < kernel.length; k++) kernel[k]! /= sum;
  const src = g.flux.slice();
  const n = src.length;
  for (let i = 0; i < n; i++) {
    let v = 0;
    for (let k = -half; k <= half; k++) {
      const j = Math.min(n - 1, Math.max(0, i + k));
      v += kernel[k + half]! * src[j]!;
    }
    g.flux[i] = v;
  }
}

/**
 * Mean flux density over each pixel [edges[i], edges[i + 1]] (vacuum Å), by the cumulative
 * integral of the fine grid (trapezoids in λ), so a pixel gets the flux that fell into it.
 */
export function integratePixels(g: FineGrid, edges: Float64Array): Float64Array {
  const n = g.lambda.length;
  const cum = new Float64Array(n);
  for (let i = 1; i < n; i++) cum[i] = cum[i - 1]! + 0.5 * (g.flux[i]! + g.flux[i - 1]!) * (g.lambda[i]! - g.lambda[i - 1]!);
  const at = (lam: number) => {
    const x = (Math.log10(lam) - g.log0) / FINE_STEP;
    const i = Math.min(n - 2, Math.max(0, Math.floor(x)));
    const t = (lam - g.lambda[i]!) / (g.lambda[i + 1]! - g.lambda[i]!);
    return cum[i]! + t * (cum[i + 1]! - cum[i]!);
  };
  const out = new Float64Array(edges.length - 1);
  for (let i = 0; i < out.length; i++) out[i] = (at(edges[i + 1]!) - at(edges[i]!)) / (edges[i + 1]! - edges[i]!);
  return out;
}
