import { describe, expect, it } from 'vitest';
import type { CombLine } from '@/lib/line-list';
import { combLinesFor, readingCombLines } from './comb-lines';

const line = (name: string, rest: number, kind: CombLine['kind'], strengthByClass: CombLine['strengthByClass'], offsets: CombLine['offsets'] = []): CombLine => ({ name, species: name, rest, kind, source: 'test', strengthByClass, offsets });

const LINES: CombLine[] = [
  line('Ly-delta', 949.7, 'absorption', {}),
  line('Ly-alpha', 1215.67, 'emission', { quasar: 1, 'lyman-break': 1 }, [{ template: 'lyman-break-lya', velocityKms: 300 }]),
  line('C II 1335', 1335.7, 'absorption', { 'lyman-break': 0.15 }),
  line('[O II] 3730', 3729.9, 'emission', { galaxy: 0.45, quasar: 0.01 }),
  line('Ca II K', 3934.8, 'absorption', { galaxy: 8, star: 3 }),
  line('TiO 7056', 7056, 'band', { galaxy: 0.15, star: 1.6 }),
  line('H-alpha', 6564.6, 'emission', { galaxy: 1.5, quasar: 2, star: 0.4 }),
];
const names = (ls: Array<{ name: string }>) => ls.map((l) => l.name);

describe('combLinesFor', () => {
  it('draws only the lines of the class, unless every line is asked for or the class is unknown', () => {
    expect(names(combLinesFor(LINES, { cls: 'lyman-break', all: false }))).toEqual(['Ly-alpha', 'C II 1335']);
    expect(names(combLinesFor(LINES, { cls: 'star', all: false }))).toEqual(['Ca II K', 'TiO 7056', 'H-alpha']);
    expect(combLinesFor(LINES, { cls: 'galaxy', all: true })).toHaveLength(LINES.length);
    expect(combLinesFor(LINES, { cls: 'unknown', all: false })).toHaveLength(LINES.length);
  });

  it('ranks labels by strength scaled within the class and kind, the solution’s own lines first', () => {
    const galaxy = new Map(combLinesFor(LINES, { cls: 'galaxy', all: false }).map((l) => [l.name, l.priority]));
    // The strongest emission line and the strongest absorption line of the class both get 1.
    expect(galaxy.get('H-alpha')).toBe(1);
    expect(galaxy.get('Ca II K')).toBe(1);
    expect(galaxy.get('[O II] 3730')).toBeCloseTo(0.3, 9); // 0.45 / 1.5
    const found = new Map(combLinesFor(LINES, { cls: 'galaxy', all: false, supporting: ['[O II] 3730'] }).map((l) => [l.name, l.priority]));
    expect(found.get('[O II] 3730')).toBeGreaterThan(found.get('H-alpha')!);
    // With every line shown a line keeps its best class's priority; a classless line gets 0.
    const all = new Map(combLinesFor(LINES, { cls: 'galaxy', all: true }).map((l) => [l.name, l.priority]));
    expect(all.get('TiO 7056')).toBe(1);
    expect(all.get('Ly-delta')).toBe(0);
  });

  it('carries the offset of the solution’s template only', () => {
    const lya = combLinesFor(LINES, { cls: 'lyman-break', all: false, template: 'lyman-break-lya' }).find((l) => l.name === 'Ly-alpha')!;
    expect(lya.offsetKms).toBe(300);
    const plain = combLinesFor(LINES, { cls: 'lyman-break', all: false, template: 'lyman-break' }).find((l) => l.name === 'Ly-alpha')!;
    expect(plain.offsetKms).toBeUndefined();
  });
});

describe('readingCombLines', () => {
  it('keeps only the lines the reading used, else its class’s lines', () => {
    expect(names(readingCombLines(LINES, ['H-alpha', '[O II] 3730'], 'galaxy'))).toEqual(['[O II] 3730', 'H-alpha']);
    expect(names(readingCombLines(LINES, [], 'lyman-break'))).toEqual(['Ly-alpha', 'C II 1335']);
  });
});
