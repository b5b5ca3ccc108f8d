import type { CombLine } from '@/lib/line-list';
import { lowerBound } from './robust-range';

/** Observed vacuum wavelength of a rest-frame feature at redshift z. */
export const observedAt = (rest: number, z: number) => rest * (1 + z);

/**
 * The comb's lines that fall on usable data at z: inside the observed range, on an unmasked pixel
 * with a finite flux and a known (or estimated) error. These pre-fill "lines used".
 */
export function linesOnData(lines: CombLine[], z: number, wavelength: Float64Array, mask: Uint8Array, flux: Float32Array): string[] {
  const n = wavelength.length;
  if (n === 0) return [];
  const lo = wavelength[0]!;
  const hi = wavelength[n - 1]!;
  const out: string[] = [];
  for (const l of lines) {
    const obs = observedAt(l.rest, z);
    if (obs < lo || obs > hi) continue;
    const i = Math.min(n - 1, lowerBound(wavelength, obs));
    if (mask[i] === 0 && Number.isFinite(flux[i]!)) out.push(l.name);
  }
  return out;
}

/**
 * One pixel in velocity as a step in ln(1+z): the engine's grid step is log10(λ) per pixel, so
 * Δ(1+z)/(1+z) = 10^step − 1. Without a scan, the median spacing of the data grid is used.
 */
export function pixelStepFactor(step: number | null, wavelength: Float64Array): number {
  if (step && step > 0) return 10 ** step - 1;
  const n = wavelength.length;
  if (n < 2) return 1e-4;
  const mid = Math.floor(n / 2);
  return Math.max(1e-6, wavelength[mid]! / wavelength[mid - 1]! - 1);
}

/** z after `pixels` velocity pixels from z: (1+z') = (1+z)(1+f)^pixels. */
export const nudgeZ = (z: number, factor: number, pixels: number) => (1 + z) * (1 + factor) ** pixels - 1;

/** The redshift that moves a marker under λ_start to λ_now: (1+z') = (1+z)·λ_now/λ_start. */
export const dragZ = (z: number, lambdaStart: number, lambdaNow: number) => ((1 + z) * lambdaNow) / lambdaStart - 1;
