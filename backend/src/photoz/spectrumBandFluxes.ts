import type { FilterCurve } from './filterCurve';
import { C_ANGSTROM_PER_S } from './photometry';

/** A spectrum's own band average in one filter, with its error from the pixel errors. */
export interface SpectrumBandFlux {
  filter: string;
  /** ⟨f_ν⟩ in nJy when the spectrum's unit is known, else in the file's unit × λ² (arbitrary scale). */
  flux: number;
  err: number;
  /** Fraction of the band's weight ∫T dλ/λ on good pixels of the spectrum (0…1). */
  covered: number;
}

/** nJy per erg s⁻¹ cm⁻² Hz⁻¹ (1 Jy = 10⁻²³ erg s⁻¹ cm⁻² Hz⁻¹). */
const NJY_PER_CGS = 1e32;

/**
 * Synthetic photometry of a spectrum through each curve: the photon-counting band average
 * ⟨f_ν⟩ = Σ T f_ν Δln λ / Σ T Δln λ over the spectrum's good pixels (mask 0, ivar > 0), its 1σ
 * error from the pixel errors (independent pixels), and the share of the band those pixels
 * cover. Pixels are summed as they are (no interpolation): a band holds many pixels of a 1D
 * spectrum. f_λ in erg s⁻¹ cm⁻² Å⁻¹ and f_ν in Jy (after `scale`) come out in nJy; any other
 * quantity is treated as f_λ of unknown scale (the result is then only good for ratios between bands).
 *
 * @param wavelength vacuum Å, increasing
 */
export function spectrumBandFluxes(
  curves: readonly FilterCurve[],
  wavelength: Float64Array,
  flux: Float64Array,
  ivar: Float64Array,
  mask: Uint8Array,
  unit: { quantity: string; scale: number },
): SpectrumBandFlux[] {
  const n = wavelength.length;
  const toFnu = (i: number, v: number): number => {
    const lam = wavelength[i]!;
    if (unit.quantity === 'f-nu') return v * unit.scale * 1e9;
    const fnu = (v * lam * lam) / C_ANGSTROM_PER_S;
    return unit.quantity === 'f-lambda' ? fnu * unit.scale * NJY_PER_CGS : fnu;
  };
  return curves.map((curve) => {
    const { wavelength: w, transmission: t } = curve;
    // The band's own weight ∫ T d(ln λ), for the covered share.
    let total = 0;
    for (let k = 1; k < w.length; k++) total += 0.5 * Math.log(w[k]! / w[k - 1]!) * (t[k - 1]! + t[k]!);
    let sw = 0;
    let swf = 0;
    let sww = 0;
    let k = 0;
    for (let i = 0; i < n; i++) {
      const lam = wavelength[i]!;
      if (lam <= w[0]! || lam >= w[w.length - 1]!) continue;
      while (k < w.length - 2 && w[k + 1]! < lam) k++;
      const tr = t[k]! + ((t[k + 1]! - t[k]!) * (lam - w[k]!)) / (w[k + 1]! - w[k]!);
      const lo = i > 0 ? wavelength[i - 1]! : lam;
      const hi = i < n - 1 ? wavelength[i + 1]! : lam;
      const weight = tr * 0.5 * Math.log(hi / lo);
      if (!(weight > 0) || mask[i] || !(ivar[i]! > 0) || !Number.isFinite(flux[i]!)) continue;
      const sigma = toFnu(i, 1 / Math.sqrt(ivar[i]!));
      sw += weight;
      swf += weight * toFnu(i, flux[i]!);
      sww += weight * weight * sigma * sigma;
    }
    return { filter: curve.name, flux: sw > 0 ? swf / sw : NaN, err: sw > 0 ? Math.sqrt(sww) / sw : NaN, covered: total > 0 ? Math.min(1, sw / total) : 0 };
  });
}
