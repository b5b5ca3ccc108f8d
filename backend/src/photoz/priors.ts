/**
 * Redshift priors for the photometric fit, as ln π(z) on the fit's grid nodes (added to
 * −χ²/2). Pure numbers, no I/O.
 */

/** Ω_m of the flat ΛCDM the volume prior uses (Planck 2018, 0.315 — the engine's PLANCK18; H₀ cancels). */
const OMEGA_M = 0.315;

/**
 * ln of the comoving volume per unit redshift, dV/dz ∝ D_C(z)² / E(z) with
 * D_C = ∫₀^z dz'/E(z') and E = √(Ω_m (1+z)³ + 1 − Ω_m) (flat ΛCDM; Hogg 1999, astro-ph/9905116,
 * eqs. 15 and 28 — from memory), normalised to its peak (z ≈ 2.2). Why: a faint source is far
 * more likely to be one of the many galaxies in the large volume at z ~ 1 than one of the few in
 * the small volume at z ~ 0.1, and the flat prior in z ignores that; a flat-in-z prior makes a
 * dusty z ≈ 0.2 fit as likely a priori as the same colours at z ≈ 1, which is where most of our
 * interloper confusion lay. The prior is floored at 10⁻³ of its peak so z = 0 stays possible.
 * Above the peak the volume falls slowly (to 0.5 of the peak by z ≈ 7): the data decide there.
 */
export function lnVolumePrior(z: Float64Array): Float64Array {
  const e = (x: number) => Math.sqrt(OMEGA_M * (1 + x) ** 3 + 1 - OMEGA_M);
  const out = new Float64Array(z.length);
  let dc = 0;
  let prev = 0;
  const steps = 64;
  for (let k = 0; k < z.length; k++) {
    // Simpson's rule on [prev, z_k] for D_C.
    const a = prev;
    const b = z[k]!;
    if (b > a) {
      const h = (b - a) / steps;
      let s = 1 / e(a) + 1 / e(b);
      for (let i = 1; i < steps; i++) s += (i % 2 ? 4 : 2) / e(a + i * h);
      dc += (s * h) / 3;
    }
    prev = b;
    out[k] = (dc * dc) / e(b);
  }
  let peak = 0;
  for (const v of out) if (v > peak) peak = v;
  for (let k = 0; k < out.length; k++) out[k] = Math.log(Math.max(out[k]! / peak, 1e-3));
  return out;
}
