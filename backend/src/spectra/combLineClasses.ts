import { selectLines, strengthKeyOf } from './buildTemplates';
import type { SpectralLine } from './lineList';
import type { TemplateRecipe } from './templateRecipes';
import type { TemplateClass } from './types';

/** Which classes' templates draw a comb line, how strongly, and where a template moves it off systemic. */
export interface CombLineClasses {
  /**
   * The largest strength the line has in a template of each class that draws it (relative line
   * flux, fractional depth or optical depth, as in lines.json); a class absent here never draws it.
   */
  strengthByClass: Partial<Record<TemplateClass, number>>;
  /** Templates that draw the line off the solution's redshift (velocity in km/s, + = redshift). */
  offsets: Array<{ template: string; velocityKms: number }>;
}

/**
 * The classes of each comb line, derived from the template recipes (the line list carries no class
 * of its own: a line belongs to a class when one of its templates' components selects it with a
 * non-zero strength, the same selection buildTemplates draws). Offsets of 0 km/s are left out.
 * Lines no template draws (e.g. Ly-δ) get no class and are shown only when the reader asks for all.
 *
 * @example combLineClasses(TEMPLATE_RECIPES, LINES).get('Ly-alpha')!.offsets // [{ template: 'lyman-break-lya', velocityKms: 300 }]
 */
export function combLineClasses(recipes: readonly TemplateRecipe[], lines: readonly SpectralLine[]): Map<string, CombLineClasses> {
  const out = new Map<string, CombLineClasses>();
  for (const l of lines) out.set(l.name, { strengthByClass: {}, offsets: [] });
  for (const recipe of recipes) {
    for (const comp of recipe.components) {
      const key = strengthKeyOf(recipe, comp);
      for (const line of selectLines(key, comp)) {
        const entry = out.get(line.name);
        if (!entry) continue; // a template-only profile (comb: false)
        const strength = line.strength[key]!;
        const seen = entry.strengthByClass[recipe.class];
        if (seen === undefined || strength > seen) entry.strengthByClass[recipe.class] = strength;
        const offset = comp.lineOffsets?.find((o) => o.names.includes(line.name));
        if (offset && offset.velocityKms !== 0 && !entry.offsets.some((o) => o.template === recipe.id)) entry.offsets.push({ template: recipe.id, velocityKms: offset.velocityKms });
      }
    }
  }
  return out;
}
