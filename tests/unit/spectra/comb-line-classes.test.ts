import { describe, expect, it } from 'vitest';
import { combLineClasses } from '../../../backend/src/spectra/combLineClasses';
import { LINES } from '../../../backend/src/spectra/lineList';
import { TEMPLATE_RECIPES } from '../../../backend/src/spectra/templateRecipes';

const classes = combLineClasses(TEMPLATE_RECIPES, LINES);
const classesOf = (name: string) => Object.keys(classes.get(name)!.strengthByClass).sort();

describe('combLineClasses: the classes of comb lines, from the template recipes', () => {
  it('gives every comb line an entry, and none to template-only profiles', () => {
    expect(classes.size).toBe(LINES.length);
    expect(classes.has('Ly-alpha absorption')).toBe(false);
  });

  it('puts each line in the classes whose templates draw it, with the largest strength of that class', () => {
    expect(classesOf('Ly-alpha')).toEqual(['lyman-break', 'quasar']);
    expect(classesOf('[O III] 5008')).toEqual(['galaxy', 'quasar']);
    expect(classes.get('[O III] 5008')!.strengthByClass).toEqual({ galaxy: 0.9, quasar: 0.25 });
    // Molecular bands of cool dwarfs and carbon stars: stars only.
    expect(classesOf('C2 5165')).toEqual(['star']);
    expect(classesOf('CaH 6385')).toEqual(['star']);
    expect(classesOf('FeH 9899')).toEqual(['star']);
    // Interstellar absorption of Lyman-break galaxies.
    expect(classesOf('C II 1335')).toEqual(['lyman-break']);
    expect(classesOf('Fe II 2600')).toEqual(['galaxy']);
  });

  it('leaves lines no template draws without a class', () => {
    expect(classesOf('Ly-delta')).toEqual([]);
    expect(classesOf('Ly-gamma')).toEqual([]);
  });

  it('carries the templates that draw a line off systemic: Lyα of the Lyα emitter at +300 km/s, quasar lines blueshifted', () => {
    expect(classes.get('Ly-alpha')!.offsets).toEqual([{ template: 'lyman-break-lya', velocityKms: 300 }]);
    expect(classes.get('C IV 1548')!.offsets).toEqual([
      { template: 'quasar', velocityKms: -2500 },
      { template: 'quasar-strong-outflow', velocityKms: -5000 },
    ]);
    // The broad Balmer component sits at 0 km/s: no offset to draw.
    expect(classes.get('H-alpha')!.offsets).toEqual([]);
  });
});
