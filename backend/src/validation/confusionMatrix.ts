import type { SpectrumClass } from '../spectra/types';

/** The classes a validation table counts, in table order: the engine's classes plus 'unknown'. */
export const VALIDATION_CLASSES: readonly SpectrumClass[] = ['galaxy', 'quasar', 'star', 'lyman-break', 'unknown'];

/** Counts of true class (rows) × found class (columns), both in VALIDATION_CLASSES order. */
export type ConfusionMatrix = Record<SpectrumClass, Record<SpectrumClass, number>>;

export function emptyConfusion(): ConfusionMatrix {
  const m = {} as ConfusionMatrix;
  for (const t of VALIDATION_CLASSES) {
    m[t] = {} as Record<SpectrumClass, number>;
    for (const f of VALIDATION_CLASSES) m[t][f] = 0;
  }
  return m;
}

/** Adds one spectrum of class `truth` that the engine called `found`. */
export function countConfusion(m: ConfusionMatrix, truth: SpectrumClass, found: SpectrumClass): void {
  m[truth][found]++;
}

/** A fixed-width text table (true class down, found class across); rows with no spectra are left out. */
export function formatConfusion(m: ConfusionMatrix, title: string): string {
  const w = 12;
  const lines = [`${title}\n${'true \\ found'.padEnd(w)}${VALIDATION_CLASSES.map((c) => c.padStart(w)).join('')}`];
  for (const t of VALIDATION_CLASSES) {
    const row = VALIDATION_CLASSES.map((f) => m[t][f]);
    if (row.every((n) => n === 0)) continue;
    lines.push(`${t.padEnd(w)}${row.map((n) => String(n).padStart(w)).join('')}`);
  }
  return lines.join('\n');
}
