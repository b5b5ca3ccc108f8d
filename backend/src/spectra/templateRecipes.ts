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
}

/** Recipes from line-lists/templates.json; the JSON is the single source of truth. */
export const TEMPLATE_RECIPES: readonly TemplateRecipe[] = data.templates as TemplateRecipe[];
