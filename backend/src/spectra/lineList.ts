import data from '../../../line-lists/lines.json';

/** What a feature looks like in a spectrum. */
export type LineKind = 'emission' | 'absorption' | 'band' | 'break';

/** One rest-frame feature from line-lists/lines.json. */
export interface SpectralLine {
  name: string;
  species: string;
  /** Rest-frame vacuum wavelength, Å. */
  rest: number;
  kind: LineKind;
  /** Relative flux (emission) or fractional depth (absorption, band), keyed by template recipe id. */
  strength: Readonly<Record<string, number>>;
  /** Where the wavelength comes from. */
  source: string;
  /** Rest-frame extent of a broad feature, Å. */
  widthA?: number;
  /** Band shape: a sharp head with absorption to the red or (C2 Swan) to the violet, or a symmetric broad trough. */
  profile?: 'head-red' | 'head-violet' | 'broad';
  /** Lorentzian half width of the line's opacity, Å (pressure-broadened lines in opacity components). */
  dampingA?: number;
  /**
   * false: a second profile of a feature already on the comb (the Lyα absorption of Lyman-break
   * galaxies beside Lyα emission), used by templates only.
   */
  comb?: boolean;
}

/** Every feature the templates may draw, sorted by rest wavelength. The JSON is the single source of truth. */
export const TEMPLATE_LINES: readonly SpectralLine[] = (data.lines as SpectralLine[]).slice().sort((a, b) => a.rest - b.rest);

/** The features of the comb and of readings: each feature once (template-only profiles left out). */
export const LINES: readonly SpectralLine[] = TEMPLATE_LINES.filter((l) => l.comb !== false);

/** Looks a feature up by its exact name; throws a RangeError naming it when absent. */
export function lineByName(name: string): SpectralLine {
  const line = LINES.find((l) => l.name === name);
  if (!line) throw new RangeError(`No line named "${name}" in line-lists/lines.json.`);
  return line;
}
