/**
 * Cohen's κ for two raters over the same items: (p_o − p_e) / (1 − p_e), where p_o is the
 * observed agreement and p_e the agreement expected from each rater's own category frequencies
 * (Cohen 1960, Educ. Psychol. Meas. 20, 37; from memory). Null when there are no items, or when
 * both raters always use one and the same category (κ is undefined there).
 *
 * @example cohensKappa(['y','y','n','n'], ['y','n','n','n']) // 0.5
 */
export function cohensKappa<T>(a: readonly T[], b: readonly T[]): number | null {
  if (a.length !== b.length) throw new RangeError(`The two raters rated different numbers of items (${a.length} and ${b.length}).`);
  const n = a.length;
  if (n === 0) return null;
  let agree = 0;
  const countA = new Map<T, number>();
  const countB = new Map<T, number>();
  for (let i = 0; i < n; i++) {
    if (a[i] === b[i]) agree += 1;
    countA.set(a[i]!, (countA.get(a[i]!) ?? 0) + 1);
    countB.set(b[i]!, (countB.get(b[i]!) ?? 0) + 1);
  }
  const po = agree / n;
  let pe = 0;
  for (const [category, na] of countA) pe += (na / n) * ((countB.get(category) ?? 0) / n);
  if (pe === 1) return null;
  return (po - pe) / (1 - pe);
}
