import { combLineClasses } from './combLineClasses';
import { LINES, type SpectralLine } from './lineList';
import { ENGINE_RECIPES } from './templateRecipes';
import type { SpectrumClass, TemplateClass } from './types';

// The same derivation the comb draws from (combLineClasses): what is measured is what is shown.
const CLASSES_OF_LINE = combLineClasses(ENGINE_RECIPES, LINES);

/**
 * The comb lines a solution of this class can show: those some template of the class draws. A
 * cool star's spectrum has no [S II] to look for, and a galaxy none of a carbon star's bands;
 * 'unknown' keeps every line.
 * Example: linesForClass('star') holds "Na D1" and "TiO 7056" but not "[S II] 6718".
 */
export function linesForClass(cls: SpectrumClass | string): readonly SpectralLine[] {
  if (cls === 'unknown') return LINES;
  return LINES.filter((l) => CLASSES_OF_LINE.get(l.name)?.strengthByClass[cls as TemplateClass] !== undefined);
}
