import type { Grade } from '@contracts/grades';

/** "4 firm": exports carry both the code and the campaign's label, and so does the screen. */
export function gradeText(scheme: readonly Grade[], code: number): string {
  const g = scheme.find((s) => s.code === code);
  return g ? `${code} ${g.label}` : `${code} (not in the grade scheme)`;
}
