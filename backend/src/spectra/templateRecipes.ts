import data from '../../../line-lists/templates.json';
import type { LineKind } from './lineList';
import type { TemplateClass } from './types';

/** Continuum shape of a template component (see line-lists/templates.json "about"). */
export type ContinuumRecipe =
  | { shape: 'power-law'; slope: number }
  | { shape: 'blackbody'; temperatureK: number; mix?: Array<{ temperatureK: number; weight: number }> };

/** A quasar's proximity zone: transmission ramping from `transmission` at Lyα to the mean IGM `velocityKms` blueward, for z ≥ fromZ. */
export interface ProximityZone {
  velocityKms: number;
  transmission: number;
  fromZ: number;
  why: string;
}

export interface ComponentRecipe {
  name: string;
  continuum?: ContinuumRecipe;
  /** Lines drawn: of these kinds, and (when given) of these species or names, minus the names in `except`. */
  select: { kind: LineKind[]; species?: string[]; names?: string[]; except?: string[] };
  igm?: 'mean' | 'red-only';
  /** Raised transmission just blueward of Lyα for IGM-attenuated quasar components. */
  proximityZone?: ProximityZone;
  /**
   * Fitted only up to this redshift (the template's z range is split there). For a component that
   * would otherwise let the template mimic another class at higher z.
   */
  zMax?: number;
  /** false: left out of synthetic spectra of the template (a variant the scan allows, not the typical object). */
  synthetic?: boolean;
  /** Why the component exists and where its numbers come from, when it is not one of the plain recipes. */
  why?: string;
  as?: 'absorption';
  /** Line strengths of this key for this component alone (overrides the recipe's). */
  strengthKey?: string;
  /** Strengths of absorption lines and bands are optical depths; the continuum is multiplied by exp(−Στ). */
  opacity?: boolean;
  /** Emission lines drawn off the systemic redshift (velocity, negative = blueshift) and with their own width. */
  lineOffsets?: Array<{ names: string[]; velocityKms: number; sigmaKms?: number; why: string }>;
}

export interface TemplateRecipe {
  id: string;
  class: TemplateClass;
  zMin: number;
  zMax: number;
  /** Intrinsic Gaussian σ of lines, km/s. */
  sigmaKms: number;
  /** Rest equivalent width (Å) of an emission line of strength 1 on a continuum component. */
  emissionEwA?: number;
  /** Use the line strengths listed under this recipe id instead of its own. */
  strengthKey?: string;
  components: ComponentRecipe[];
  /**
   * Built but not scanned over the whole range: a variant that refineQuasarBlueshift.ts fits only
   * near the quasar candidates of the scan (set in code, never in templates.json).
   */
  refineOnly?: boolean;
}

/** Recipes from line-lists/templates.json; the JSON is the single source of truth. */
export const TEMPLATE_RECIPES: readonly TemplateRecipe[] = data.templates as TemplateRecipe[];

/**
 * Blueshifts (km/s, toward us) of the quasar's high-ionisation group that the refinement fits
 * (refineQuasarBlueshift.ts): 0 … 6000 in steps of 500. C IV blueshifts of quasars run from ≈ 0 to
 * ≳ 5000 km/s (from memory: Richards et al. 2011; Meyer et al. 2019); the scan's two fixed
 * templates sit at 2500 ('quasar') and 5000 ('quasar-strong-outflow') and stand for those steps.
 */
export const QUASAR_BLUESHIFTS_KMS: readonly number[] = Array.from({ length: 13 }, (_, k) => 500 * k);

/** Template id of the quasar whose high-ionisation lines sit `blueshiftKms` blueward of systemic. */
export function quasarTemplateId(blueshiftKms: number): string {
  if (blueshiftKms === 2500) return 'quasar';
  if (blueshiftKms === 5000) return 'quasar-strong-outflow';
  return `quasar-blueshift-${blueshiftKms}`;
}

/** The high-ionisation blueshift (km/s) of a quasar template id, or undefined for other templates. */
export function quasarBlueshiftOf(templateId: string): number | undefined {
  return QUASAR_BLUESHIFTS_KMS.find((v) => quasarTemplateId(v) === templateId);
}

/**
 * The quasar recipe with its high-ionisation group moved to each blueshift of the refinement grid
 * that the two scanned quasars do not already hold: same continuum, lines, widths, strengths and
 * proximity zone, only the group's velocity differs.
 */
/** The high-ionisation blueshift of the 'quasar' recipe, km/s: its line offsets are that step's. */
const BASE_BLUESHIFT_KMS = 2500;

function quasarBlueshiftRecipes(recipes: readonly TemplateRecipe[]): TemplateRecipe[] {
  const base = recipes.find((r) => r.id === 'quasar');
  if (!base) return [];
  return QUASAR_BLUESHIFTS_KMS.filter((v) => !recipes.some((r) => r.id === quasarTemplateId(v))).map((v) => ({
    ...base,
    id: quasarTemplateId(v),
    strengthKey: base.strengthKey ?? base.id,
    refineOnly: true,
    components: base.components.map((c) => ({
      ...c,
      // Each offset group scales with the step (C III] keeps its share of C IV's blueshift).
      ...(c.lineOffsets ? { lineOffsets: c.lineOffsets.map((o) => ({ ...o, velocityKms: (o.velocityKms * v) / BASE_BLUESHIFT_KMS, why: `The quasar's high-ionisation group at ${v} km/s blueward of systemic (lines of a smaller share in proportion): a step of the fitted blueshift (refineQuasarBlueshift.ts).` })) } : {}),
    })),
  }));
}

/** Every template the engine builds: the recipes of templates.json and the quasar blueshift steps. */
export const ENGINE_RECIPES: readonly TemplateRecipe[] = [...TEMPLATE_RECIPES, ...quasarBlueshiftRecipes(TEMPLATE_RECIPES)];
