import { LINES, type SpectralLine } from './lineList';
import { TEMPLATE_RECIPES } from './templateRecipes';
import type { SpectrumClass } from './types';

/** Which class each strength key of lines.json belongs to: recipe ids and the strength keys their components use. */
const KEY_CLASS = new Map<string, string>();
for (const r of TEMPLATE_RECIPES) {
  KEY_CLASS.set(r.id, r.class);
  if (r.strengthKey) KEY_CLASS.set(r.strengthKey, r.class);
  for (const c of r.components) if (c.strengthKey) KEY_CLASS.set(c.strengthKey, r.class);
}

/**
 * The comb lines a solution of this class can show: those some template of the class draws (a
 * strength for one of its recipes). A cool star's spectrum has no [S II] to look for, and a
 * galaxy none of a carbon star's bands; 'unknown' keeps every line.
 * Example: linesForClass('star') holds "Na D1" and "TiO 7056" but not "[S II] 6718".
 */
export function linesForClass(cls: SpectrumClass | string): readonly SpectralLine[] {
  if (cls === 'unknown') return LINES;
  return LINES.filter((l) => Object.keys(l.strength).some((key) => KEY_CLASS.get(key) === cls));
}
