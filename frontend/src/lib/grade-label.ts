import type { Grade } from '@contracts/grades';

/**
 * A grade as screens show it: exports carry both code and label, and so does the screen. Digit
 * codes (schemes made before codes were words) read "4 firm"; a word code that is its own label
 * reads "sure"; another reads "no redshift (no-z)".
 */
export function gradeText(scheme: readonly Grade[], code: string): string {
  const g = scheme.find((s) => s.code === code);
  if (!g) return `${code} (not in the grade scheme)`;
  if (/^\d+$/.test(code)) return `${code} ${g.label}`;
  return g.label.toLowerCase() === code.toLowerCase() ? g.label : `${g.label} (${code})`;
}

/** Position of a grade in its scheme, 0 = most confident (schemes list the most confident first); the end for unknown codes. */
export function gradeRank(scheme: readonly Grade[], code: string): number {
  const i = scheme.findIndex((g) => g.code === code);
  return i < 0 ? scheme.length : i;
}

/**
 * The grade a digit key gives: a grade whose code is that digit (older schemes, 4 … 0), else the
 * grade at that place in the scheme (1 = the first, most confident). Null when there is none.
 */
export function gradeForKey(scheme: readonly Grade[], digit: number): string | null {
  const byCode = scheme.find((g) => g.code === String(digit));
  if (byCode) return byCode.code;
  return digit >= 1 ? (scheme[digit - 1]?.code ?? null) : null;
}
