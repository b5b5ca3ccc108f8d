import { shiftToZ, zToShift } from './logGrid';
import type { TemplateCurve } from './scanTemplate';

/**
 * The interloper question every dropout paper must answer: could this "Lyman break" be a 4000 Å
 * or Balmer break at low redshift, or a cool star? For a Lyman-break solution at z the break in
 * the data sits at λ_b = 1215.67 (1 + z); a 4000 Å-break galaxy puts its Ca II K/4000 Å edge
 * there at (1 + z_m) = (1 + z)·1215.67/3933.66 ≈ (1 + z)/3.24, and a Balmer-break (post-starburst)
 * galaxy at (1 + z)·1215.67/3646. The check reads the best χ² of the absorption-line galaxy
 * between those two redshifts (± 2 % in 1 + z for the break's width), and of each star template at
 * z ≈ 0, from the scan's own curves, adds the same lazy checks (shape, single feature) the
 * solution got, and reports Δχ² = χ²(alternative) − χ²(solution): positive means the Lyman-break
 * reading is preferred by that much.
 */

/** Rest wavelengths, Å: Lyα, Ca II K (the sharp edge of the 4000 Å break) and the Balmer limit (NIST; line-lists/lines.json). */
const LY_ALPHA = 1215.67;
const CA_K = 3934.777;
const BALMER_LIMIT = 3646.0;
/** Slack in 1 + z around the mirror range (the break edges are ≈ 100 Å wide). */
const SLACK = 0.02;

export type InterloperKind = '4000-break' | 'cool-star' | 'brown-dwarf' | 'carbon-star';

export interface Interloper {
  kind: InterloperKind;
  /** For readers: "4000 Å break at z = 0.20". */
  label: string;
  template: string;
  z: number;
  /** χ²(alternative) − χ²(solution); > 0 favours the solution. */
  deltaChi2: number;
}

/** Star templates and the interloper each stands for. */
const STAR_KINDS: Record<string, { kind: InterloperKind; name: string }> = {
  'star-cool': { kind: 'cool-star', name: 'Cool star (M dwarf)' },
  'star-ultracool': { kind: 'brown-dwarf', name: 'Brown dwarf (L/T)' },
  'star-carbon': { kind: 'carbon-star', name: 'Carbon star' },
};

/** The absorption-line galaxy template whose 4000 Å and Balmer breaks are the mirror alternative. */
const BREAK_GALAXY = 'galaxy-absorption';

/**
 * Alternatives to a Lyman-break solution at z with total χ² `chi2`.
 *
 * @param lazyChi2 the lazy checks' χ² (shape, single feature) of a template at an integer shift
 */
export function interloperAlternatives(z: number, chi2: number, curves: TemplateCurve[], step: number, lazyChi2: (curve: TemplateCurve, shift: number) => number): Interloper[] {
  const out: Interloper[] = [];
  const breakCurve = curves.find((c) => c.template.id === BREAK_GALAXY);
  if (breakCurve) {
    const lo = ((1 + z) * LY_ALPHA) / CA_K / (1 + SLACK) - 1;
    const hi = ((1 + z) * LY_ALPHA * (1 + SLACK)) / BALMER_LIMIT - 1;
    const best = lowestIn(breakCurve, Math.max(lo, breakCurve.template.zMin), Math.min(hi, breakCurve.template.zMax), step);
    if (best) {
      const zm = shiftToZ(best.shift, step);
      out.push({ kind: '4000-break', label: `4000 Å break at z = ${zm.toFixed(2)}`, template: BREAK_GALAXY, z: zm, deltaChi2: best.chi2 + lazyChi2(breakCurve, best.shift) - chi2 });
    }
  }
  for (const c of curves) {
    const star = STAR_KINDS[c.template.id];
    if (!star) continue;
    const best = lowestIn(c, c.template.zMin, c.template.zMax, step);
    if (best) out.push({ kind: star.kind, label: `${star.name} at z = 0`, template: c.template.id, z: shiftToZ(best.shift, step), deltaChi2: best.chi2 + lazyChi2(c, best.shift) - chi2 });
  }
  return out;
}

/** Lowest χ² of a curve between two redshifts, with its integer shift. */
function lowestIn(c: TemplateCurve, zLo: number, zHi: number, step: number): { shift: number; chi2: number } | undefined {
  if (!(zHi >= zLo)) return undefined;
  const a = Math.max(0, Math.ceil(zToShift(zLo, step)) - c.sMin);
  const b = Math.min(c.chi2.length - 1, Math.floor(zToShift(zHi, step)) - c.sMin);
  if (b < a) return undefined;
  let best = a;
  for (let i = a + 1; i <= b; i++) if (c.chi2[i]! < c.chi2[best]!) best = i;
  return { shift: c.sMin + best, chi2: c.chi2[best]! };
}
