import type { CombLine, LineKind } from '@/lib/line-list';

/** A comb line as one comb draws it: how much its label matters, and where the solution's template puts it. */
export interface PlotLine extends CombLine {
  /** Higher keeps its label when labels crowd (label-layout.ts). */
  priority: number;
  /** The solution's template draws this line off systemic by this much (km/s, + = redward). */
  offsetKms?: number;
}

/** The classes the comb can be narrowed to: those of the engine's templates. */
export type CombClass = 'galaxy' | 'quasar' | 'star' | 'lyman-break';
const COMB_CLASSES: readonly string[] = ['galaxy', 'quasar', 'star', 'lyman-break'];
export const isCombClass = (c: string | null | undefined): c is CombClass => typeof c === 'string' && COMB_CLASSES.includes(c);

/** Priority of a line the solution names as supporting it: above every strength (which are ≤ 1 after scaling). */
const SUPPORTING = 10;

export interface CombLineChoice {
  /** The selected solution's (or the reader's) class; 'unknown' or anything else shows every line. */
  cls: string;
  /** The reader asked for every line, whatever the class. */
  all: boolean;
  /** The solution's template id: its line offsets are drawn. */
  template?: string | null;
  /** Line names the solution reports as found: their labels are kept first. */
  supporting?: readonly string[];
}

/**
 * The lines one comb draws: those of the class (lines some template of that class draws, from the
 * line list's `strengthByClass`) unless all are asked for or the class is not a template class.
 * Each gets a label priority: the line's strength in that class scaled by the strongest line of
 * the same kind there (emission, absorption, band and break strengths are on different scales:
 * flux ratios, depths, optical depths), so every kind's strongest lines keep their names; lines
 * the solution found come first. With every line shown, a line takes its best class's priority.
 *
 * @example combLinesFor(lines, { cls: 'star', all: false }).every((l) => l.strengthByClass.star !== undefined) // true
 */
export function combLinesFor(lines: readonly CombLine[], choice: CombLineChoice): PlotLine[] {
  const narrowed = !choice.all && isCombClass(choice.cls);
  const strongest = strongestByClassAndKind(lines);
  const supporting = new Set(choice.supporting ?? []);
  const out: PlotLine[] = [];
  for (const l of lines) {
    const own = narrowed ? l.strengthByClass[choice.cls as CombClass] : undefined;
    if (narrowed && own === undefined) continue;
    let priority = 0;
    if (narrowed) priority = scaled(own!, strongest.get(key(choice.cls, l.kind)));
    else for (const [c, s] of Object.entries(l.strengthByClass)) priority = Math.max(priority, scaled(s, strongest.get(key(c, l.kind))));
    if (supporting.has(l.name)) priority += SUPPORTING;
    const offset = choice.template ? l.offsets.find((o) => o.template === choice.template) : undefined;
    out.push(offset ? { ...l, priority, offsetKms: offset.velocityKms } : { ...l, priority });
  }
  return out;
}

/**
 * The lines a reading names, in line-list order, each with top priority (the settlement view
 * draws only what each reader used). A reading with no lines falls back to its class's lines.
 */
export function readingCombLines(lines: readonly CombLine[], used: readonly string[], cls: string): PlotLine[] {
  if (used.length === 0) return combLinesFor(lines, { cls, all: false });
  const names = new Set(used);
  return lines.filter((l) => names.has(l.name)).map((l) => ({ ...l, priority: SUPPORTING }));
}

const key = (cls: string, kind: LineKind) => `${cls} ${kind}`;
const scaled = (s: number, max: number | undefined) => (max && max > 0 ? Math.min(1, s / max) : 0);

function strongestByClassAndKind(lines: readonly CombLine[]): Map<string, number> {
  const out = new Map<string, number>();
  for (const l of lines) {
    for (const [c, s] of Object.entries(l.strengthByClass)) {
      const k = key(c, l.kind);
      if (s > (out.get(k) ?? 0)) out.set(k, s);
    }
  }
  return out;
}
