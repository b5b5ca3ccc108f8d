/** A "nice" step (1, 2 or 5 × 10^k) at least `raw`. */
export function niceStep(raw: number): number {
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
}

/**
 * Tick positions on the observed-wavelength scale that fall on round rest-frame wavelengths at
 * z, so the rest-frame axis reads 3700, 3800, … while the data stay in the observed frame.
 */
export function restFrameSplits(min: number, max: number, z: number, targetTicks: number): number[] {
  const k = 1 + z;
  const lo = min / k;
  const hi = max / k;
  const step = niceStep((hi - lo) / Math.max(2, targetTicks));
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi; v += step) out.push(v * k);
  return out;
}

/** Decimals that show a tick step without noise (step 0.5 → 1, step 20 → 0). */
export const decimalsFor = (step: number) => Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
