import { buildTemplates, type BuiltTemplate } from '../spectra/buildTemplates';
import { LYMAN_LIMIT_A, lymanBreakTemplate, redden, REST_GRID, restSedOnGrid, type RestGrid, type RestTemplate } from './restTemplates';

/** The photo-z template set: rest-frame f_ν templates on one grid. */
export interface TemplateSet {
  grid: RestGrid;
  templates: RestTemplate[];
}

/**
 * Log-λ step (dex) of the engine build the low-z and star templates are taken from: 1e-3 dex
 * (≈ 0.23 %) is finer than REST_GRID's cells (0.2 % in ln λ), so every cell averages ≥ 1 sample,
 * and the engine's molecular bands and breaks (tens to hundreds of Å wide) are resolved.
 */
const ENGINE_STEP_DEX = 1e-3;
/** Instrument σ of that build, grid pixels: the engine needs one; one pixel of 0.23 % blurs nothing a broad band sees. */
const ENGINE_SIGMA_PX = 1;
/** Continuum-filter width of that build, pixels: only the filtered vectors use it, and we take the unfiltered ones. */
const ENGINE_FILTER_PX = 101;
/** f_λ of every mix component is normalised over this rest window (Å) before weighting. */
const NORM_WINDOW_A: [number, number] = [5400, 5600];

/**
 * A low-z mix, in shares of f_λ at 5500 Å: the engine's absorption-line galaxy components ("old
 * stars": 4500 K + 3500 K blackbodies with metal lines and the 4000 Å break; "A stars": 9500 K
 * with Balmer lines and jump), a young power law f_λ ∝ λ^−2 above 912 Å (the O/B stars a 9500 K
 * blackbody lacks; the same recipe as the Lyman-break templates), and the engine's emission-line
 * galaxy line groups at `lineScale` × LINE_EW_A. Shares and dust grids are our own numbers
 * (common practice: elliptical → S0/Sa → Sb → star-forming, chosen by eye against the colour
 * check in tests/reference/photoz-templates.test.ts, not fitted).
 */
interface LowZMix {
  name: string;
  old: number;
  aStars: number;
  young: number;
  lineScale: number;
  ebv: number[];
}

/**
 * The star-forming mix is also the pairs' blue component (templatePairs.ts), so its dust is
 * gridded at 0.125 in E_s(B−V) rather than 0.25: the pair's UV-to-optical shape comes from it alone.
 * Tuning seeds 777 / 778: interloper outliers 219 → 199 / 226 → 197 of 800, LBG 18 → 17 / 10 → 9.
 * Tried and dropped on 777: the same grid on to 1.5 (215), old and early to E_s(B−V) 0.8 (224).
 */
const LOW_Z_MIXES: LowZMix[] = [
  { name: 'old', old: 0.95, aStars: 0.05, young: 0, lineScale: 0, ebv: [0, 0.2, 0.4] },
  { name: 'early', old: 0.85, aStars: 0.15, young: 0, lineScale: 0, ebv: [0, 0.2, 0.4] },
  { name: 'spiral', old: 0.75, aStars: 0.2, young: 0.05, lineScale: 0.5, ebv: [0, 0.25, 0.5, 0.75, 1.0] },
  { name: 'starforming', old: 0.3, aStars: 0.3, young: 0.4, lineScale: 1, ebv: [0, 0.125, 0.25, 0.375, 0.5, 0.625, 0.75, 0.875, 1.0] },
];

/**
 * Rest equivalent width (Å) of each emission-line group of the engine's galaxy-emission recipe at
 * lineScale 1, summed over the group's lines. Our numbers, of the order of star-forming galaxies at
 * z ≈ 1 (from memory: EW(Hα) ~ 100 Å, EW([O II]) ~ 30 Å); lines move a broad band by ≲ 0.1 mag.
 */
const LINE_EW_A: Record<string, number> = { 'H-alpha region': 100, 'H-beta and [O III]': 80, '[O II] and [Ne III]': 30 };

/** Stars: engine components taken alone (or in a mix, by f_λ share at 5500 Å), at z = 0. */
const STARS: Array<{ id: string; parts: Array<[template: string, component: string, share: number]> }> = [
  { id: 'star-M0', parts: [['star-cool', 'M0 dwarf', 1]] },
  { id: 'star-M4', parts: [['star-cool', 'M4 dwarf', 1]] },
  { id: 'star-M8', parts: [['star-cool', 'M8 dwarf', 1]] },
  { id: 'star-L2', parts: [['star-ultracool', 'L2 dwarf', 1]] },
  { id: 'star-L7', parts: [['star-ultracool', 'L7 dwarf', 1]] },
  { id: 'star-T5', parts: [['star-ultracool', 'T5 dwarf', 1]] },
  { id: 'star-carbon', parts: [['star-carbon', 'carbon star', 1]] },
  { id: 'star-carbon-warm', parts: [['star-carbon', 'carbon star', 0.5], ['star-carbon', 'warm continuum', 0.5]] },
];

let cached: TemplateSet | undefined;

/**
 * The photo-z templates, built from our own analytical recipes (never from measured spectra) on
 * first call and kept for the life of the process (≈ 0.5 s):
 * - 14 Lyman-break power laws f_λ ∝ λ^β, β = −2.6 … −1.4 (0.2), without / with Lyα (EW₀ 50 Å);
 * - 20 low-z mixes (LOW_Z_MIXES) of the engine's absorption-line galaxy components, a young power
 *   law and the emission-line galaxy's lines, each reddened by Calzetti et al. (2000);
 * - 8 cool stars from the engine's star-cool, star-ultracool and star-carbon components.
 * The engine's vectors span 300 Å – 3.2 µm rest; redward they continue as f_λ ∝ λ⁻⁴
 * (Rayleigh–Jeans), and galaxies get nothing below the Lyman limit.
 */
export function photoZTemplates(): TemplateSet {
  cached ??= buildPhotoZTemplates();
  return cached;
}

/** Builds the set photoZTemplates caches (exported for tests that need a fresh build). */
export function buildPhotoZTemplates(grid: RestGrid = REST_GRID): TemplateSet {
  const templates: RestTemplate[] = [];
  for (let k = 0; k <= 6; k++) {
    const beta = Number((-2.6 + 0.2 * k).toFixed(1));
    for (const ew of [0, 50]) templates.push(lymanBreakTemplate(beta, ew, grid));
  }
  const engine = buildTemplates(ENGINE_STEP_DEX, ENGINE_SIGMA_PX, ENGINE_FILTER_PX);
  const lambda = new Float64Array(engine.length);
  for (let j = 0; j < engine.length; j++) lambda[j] = 10 ** ((engine.h0 + j) * ENGINE_STEP_DEX);
  const byId = new Map(engine.templates.map((t) => [t.id, t]));
  const vector = (templateId: string, component: string) => componentVector(byId.get(templateId), templateId, component);
  const coverage: [number, number] = [lambda[0]!, lambda[lambda.length - 1]!];

  const old = normalised(lambda, vector('galaxy-absorption', 'old stars'));
  const aStars = normalised(lambda, vector('galaxy-absorption', 'A stars'));
  const young = normalised(lambda, Float64Array.from(lambda, (l) => (l >= LYMAN_LIMIT_A ? Math.pow(l, -2) : 0)));
  const lineGroups = Object.entries(LINE_EW_A).map(([name, ew]) => ({ name, ew, v: vector('galaxy-emission', name) }));
  for (const mix of LOW_Z_MIXES) {
    const flam = new Float64Array(lambda.length);
    for (let j = 0; j < lambda.length; j++) flam[j] = mix.old * old[j]! + mix.aStars * aStars[j]! + mix.young * young[j]!;
    if (mix.lineScale > 0) for (const g of lineGroups) addLines(flam, lambda, g.v, mix.lineScale * g.ew);
    for (let j = 0; j < lambda.length; j++) if (lambda[j]! < LYMAN_LIMIT_A) flam[j] = 0;
    const sed = restSedOnGrid(lambda, flam, { blue: 'zero', red: 'rayleigh-jeans' }, grid);
    const recipe = `old stars ${mix.old}, A stars ${mix.aStars}, f_λ ∝ λ⁻² ${mix.young} (shares of f_λ at 5500 Å)${mix.lineScale > 0 ? `, emission lines × ${mix.lineScale}` : ''}`;
    for (const ebv of mix.ebv) {
      templates.push({
        id: `lowz-${mix.name}${ebv > 0 ? `-ebv${ebv.toFixed(2)}` : ''}`, kind: 'low-z', class: 'galaxy', coverage,
        source: `engine galaxy-absorption/galaxy-emission recipes: ${recipe}${ebv > 0 ? `; Calzetti et al. (2000) E_s(B−V) = ${ebv.toFixed(2)}` : ''}; f_λ ∝ λ⁻⁴ beyond ${Math.round(coverage[1])} Å`,
        fnu: ebv > 0 ? redden(Float64Array.from(sed.fnu), ebv, grid) : sed.fnu,
      });
    }
  }
  for (const star of STARS) {
    const flam = new Float64Array(lambda.length);
    for (const [tid, comp, share] of star.parts) {
      const v = normalised(lambda, vector(tid, comp));
      for (let j = 0; j < lambda.length; j++) flam[j]! += share * v[j]!;
    }
    const sed = restSedOnGrid(lambda, flam, { blue: 'zero', red: 'rayleigh-jeans' }, grid);
    templates.push({
      id: star.id, kind: 'star', class: 'star', coverage,
      source: `engine ${star.parts.map(([t, c, s]) => `${t}/${c}${star.parts.length > 1 ? ` ${s}` : ''}`).join(' + ')} at z = 0; f_λ ∝ λ⁻⁴ beyond ${Math.round(coverage[1])} Å`,
      fnu: sed.fnu,
    });
  }
  return { grid, templates };
}

/** The unfiltered rest-frame vector (f_λ, arbitrary scale) of one component of an engine template. */
function componentVector(t: BuiltTemplate | undefined, templateId: string, component: string): Float64Array {
  const b = t?.basis.find((x) => x.label === component);
  if (!b) throw new Error(`photo-z templates: the engine has no component '${component}' in template '${templateId}'`);
  return b.unfiltered;
}

/** A copy scaled to mean 1 over NORM_WINDOW_A. */
function normalised(lambda: Float64Array, v: Float64Array): Float64Array {
  let s = 0;
  let n = 0;
  for (let j = 0; j < lambda.length; j++) if (lambda[j]! >= NORM_WINDOW_A[0] && lambda[j]! <= NORM_WINDOW_A[1]) { s += v[j]!; n++; }
  if (!(s > 0)) throw new Error('photo-z templates: a component has no flux at 5500 Å');
  return Float64Array.from(v, (x) => x / (s / n));
}

/**
 * Adds a line group scaled so that its summed rest equivalent width is `ewA`, measured on the
 * continuum `flam` at the group's strongest pixel (Hα, [O III] 5008, [O II] 3727…3730).
 */
function addLines(flam: Float64Array, lambda: Float64Array, v: Float64Array, ewA: number): void {
  let flux = 0;
  let peak = 0;
  for (let j = 1; j < lambda.length; j++) {
    flux += v[j]! * (lambda[j]! - lambda[j - 1]!);
    if (v[j]! > v[peak]!) peak = j;
  }
  if (!(flux > 0)) return;
  const scale = (ewA * flam[peak]!) / flux;
  for (let j = 0; j < lambda.length; j++) flam[j]! += scale * v[j]!;
}
