import type { FluxUnit } from './types';

/**
 * The flux units Redward names. A file value × `scale` is the value in the normalised unit:
 * f_λ in erg s⁻¹ cm⁻² Å⁻¹, f_ν in Jy, counts as counts, ADU or electrons (per second for rates).
 */
export const FLUX_LAMBDA = 'erg s⁻¹ cm⁻² Å⁻¹';
export const FLUX_NU = 'Jy';

/** Dimensions of a unit term: energy, time, length (cgs) and three kinds of detector count. */
interface Dims {
  E: number;
  T: number;
  L: number;
  ct: number;
  adu: number;
  el: number;
}
type DimKey = keyof Dims;

interface Term {
  /** The term's size in cgs (erg, s, cm) or in its own count. */
  factor: number;
  dims: Partial<Dims>;
  /** Wavelength units, to recognise the common "erg/cm/s/Ang" spelling (cm² meant). */
  wavelength?: boolean;
}

// Sizes in cgs. 1 Jy = 1e-23 erg s⁻¹ cm⁻² Hz⁻¹, and Hz⁻¹ = s, so a jansky is erg cm⁻² (IAU
// Style Manual, Wilkins 1989, §5.15 — from memory). 1 W = 1e7 erg s⁻¹; 1 Å = 1e-8 cm.
const JY = 1e-23;
const UNITS: Record<string, Term> = {
  erg: { factor: 1, dims: { E: 1 } },
  ergs: { factor: 1, dims: { E: 1 } },
  j: { factor: 1e7, dims: { E: 1 } },
  joule: { factor: 1e7, dims: { E: 1 } },
  w: { factor: 1e7, dims: { E: 1, T: -1 } },
  watt: { factor: 1e7, dims: { E: 1, T: -1 } },
  watts: { factor: 1e7, dims: { E: 1, T: -1 } },
  s: { factor: 1, dims: { T: 1 } },
  sec: { factor: 1, dims: { T: 1 } },
  second: { factor: 1, dims: { T: 1 } },
  seconds: { factor: 1, dims: { T: 1 } },
  hz: { factor: 1, dims: { T: -1 } },
  cm: { factor: 1, dims: { L: 1 } },
  m: { factor: 100, dims: { L: 1 } },
  a: { factor: 1e-8, dims: { L: 1 }, wavelength: true },
  aa: { factor: 1e-8, dims: { L: 1 }, wavelength: true },
  ang: { factor: 1e-8, dims: { L: 1 }, wavelength: true },
  angs: { factor: 1e-8, dims: { L: 1 }, wavelength: true },
  angstrom: { factor: 1e-8, dims: { L: 1 }, wavelength: true },
  angstroms: { factor: 1e-8, dims: { L: 1 }, wavelength: true },
  nm: { factor: 1e-7, dims: { L: 1 }, wavelength: true },
  um: { factor: 1e-4, dims: { L: 1 }, wavelength: true },
  micron: { factor: 1e-4, dims: { L: 1 }, wavelength: true },
  microns: { factor: 1e-4, dims: { L: 1 }, wavelength: true },
  jy: { factor: JY, dims: { E: 1, L: -2 } },
  jansky: { factor: JY, dims: { E: 1, L: -2 } },
  mjy: { factor: JY * 1e-3, dims: { E: 1, L: -2 } },
  ujy: { factor: JY * 1e-6, dims: { E: 1, L: -2 } },
  microjy: { factor: JY * 1e-6, dims: { E: 1, L: -2 } },
  njy: { factor: JY * 1e-9, dims: { E: 1, L: -2 } },
  adu: { factor: 1, dims: { adu: 1 } },
  adus: { factor: 1, dims: { adu: 1 } },
  dn: { factor: 1, dims: { adu: 1 } },
  count: { factor: 1, dims: { ct: 1 } },
  counts: { factor: 1, dims: { ct: 1 } },
  ct: { factor: 1, dims: { ct: 1 } },
  cts: { factor: 1, dims: { ct: 1 } },
  electron: { factor: 1, dims: { el: 1 } },
  electrons: { factor: 1, dims: { el: 1 } },
  e: { factor: 1, dims: { el: 1 } },
};

/** Whole spellings that name a unit without composing one. */
const WORDS: Record<string, string> = {
  // The synthetic-photometry shorthands for erg s⁻¹ cm⁻² Å⁻¹ and erg s⁻¹ cm⁻² Hz⁻¹ (common practice).
  flam: 'erg/s/cm2/A',
  fnu: 'erg/s/cm2/Hz',
};

/** Words by which a file says its flux has no physical unit. */
const ARBITRARY = /^(arbitrary|arb\.?|a\.?u\.?|relative|normali[sz]ed|unitless|dimensionless|none|scaled|-)(\s+(units?|flux|scale))?$/;

/** The unit of a file that says nothing, or nothing Redward understands. */
export function arbitraryFluxUnit(raw: string | null = null): FluxUnit {
  return { quantity: 'arbitrary', scale: 1, unit: 'arbitrary', raw };
}

/**
 * Reads a flux unit as files write it (FITS BUNIT / TUNITn, text headers) into a normalised
 * unit. Returns null when the text is not a flux unit Redward knows; an explicit "arbitrary" or
 * "normalised" is an arbitrary unit, not an unknown one.
 *
 * @example parseFluxUnit('1E-17 erg/cm^2/s/Ang') // { quantity: 'f-lambda', scale: 1e-17, unit: 'erg s⁻¹ cm⁻² Å⁻¹', raw: '1E-17 erg/cm^2/s/Ang' }
 * @example parseFluxUnit('mJy')?.scale // 0.001 (Jy)
 */
export function parseFluxUnit(raw: string): FluxUnit | null {
  const text = normalise(raw);
  if (text === '' || ARBITRARY.test(text)) return arbitraryFluxUnit(raw);
  // Own keys only: a unit string such as "__proto__" must not reach Object.prototype.
  const word = Object.hasOwn(WORDS, text) ? WORDS[text]! : undefined;
  const parsed = parseExpression(word?.toLowerCase() ?? text);
  if (!parsed) return null;
  const { factor, dims, cmOverWavelength } = parsed;
  const d = (k: DimKey) => dims[k] ?? 0;
  const counts = d('ct') !== 0 || d('adu') !== 0 || d('el') !== 0;
  const scale = (x: number) => Number(x.toPrecision(12));
  if (!counts) {
    // "erg/cm/s/Ang", as some archives wrote it, is f_λ with the square of cm lost (common practice).
    const L = d('L') === -2 && d('T') === -1 && cmOverWavelength ? -3 : d('L');
    if (d('E') === 1 && d('T') === -1 && L === -3) return { quantity: 'f-lambda', scale: scale(factor / 1e8), unit: FLUX_LAMBDA, raw };
    if (d('E') === 1 && d('T') === 0 && L === -2) return { quantity: 'f-nu', scale: scale(factor / JY), unit: FLUX_NU, raw };
    return null;
  }
  const kinds = (['ct', 'adu', 'el'] as const).filter((k) => d(k) !== 0);
  if (kinds.length !== 1 || d(kinds[0]!) !== 1 || d('E') !== 0 || d('L') !== 0) return null;
  const name = { ct: 'counts', adu: 'ADU', el: 'electrons' }[kinds[0]!];
  if (d('T') === 0) return { quantity: 'counts', scale: scale(factor), unit: name, raw };
  if (d('T') === -1) return { quantity: 'count-rate', scale: scale(factor), unit: `${name} s⁻¹`, raw };
  return null;
}

function normalise(raw: string): string {
  return raw
    .trim()
    .replace(/Å/g, 'angstrom')
    .replace(/[µμ]/g, 'u')
    .replace(/[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+/g, (m) => '^' + [...m].map((c) => (c === '⁻' ? '-' : c === '⁺' ? '+' : String('⁰¹²³⁴⁵⁶⁷⁸⁹'.indexOf(c)))).join(''))
    .replace(/[×·]/g, '*')
    .replace(/\*\*/g, '^')
    .replace(/e-\/|e-\s*s/gi, (m) => m.replace('e-', 'electrons'))
    .replace(/^e-$/i, 'electrons')
    .replace(/[[\]{}]/g, ' ')
    .toLowerCase()
    .replace(/\s+/g, ' ')
    .trim()
    // "x 1e-17 erg…", "×10^-17 …": a leading multiplication sign before the scale.
    .replace(/^(?:x|\*)\s*(?=\d)/, '');
}

interface Parsed {
  factor: number;
  dims: Partial<Dims>;
  cmOverWavelength: boolean;
}

/**
 * A small recursive-descent reader of unit products: terms joined by spaces, '*', '.' or '/'
 * (each '/' divides by the next term only, as FITS unit strings are read), parentheses,
 * exponents written 'cm2', 'cm-2', 'cm^2', 'cm^(-2)', and numbers ('1e-17', '10^-17').
 */
function parseExpression(text: string): Parsed | null {
  const tokens = text.match(/\d+(?:\.\d+)?(?:e[+-]?\d+)?|\.\d+(?:e[+-]?\d+)?|[a-z]+|[()^/*.+-]|\s+/g);
  if (!tokens || tokens.join('') !== text) return null;
  const toks = tokens.filter((t) => t.trim() !== '');
  let i = 0;
  let cmDivided = false;
  let wavelengthDivided = false;
  const out = { factor: 1, dims: {} as Partial<Dims> };

  const exponent = (): number | null => {
    let t = toks[i];
    if (t === '^') t = toks[++i];
    let paren = false;
    if (t === '(') {
      paren = true;
      t = toks[++i];
    }
    let sign = 1;
    if (t === '-' || t === '+') {
      sign = t === '-' ? -1 : 1;
      t = toks[++i];
    }
    if (t === undefined || !/^\d+$/.test(t)) return null;
    i++;
    if (paren) {
      if (toks[i] !== ')') return null;
      i++;
    }
    return sign * Number(t);
  };

  // One term, raised to its exponent, folded into `acc` with power `sign` (+1 or −1 after '/').
  const term = (acc: { factor: number; dims: Partial<Dims> }, sign: number): boolean => {
    const t = toks[i];
    if (t === undefined) return false;
    let factor: number;
    let dims: Partial<Dims> = {};
    let unitName: string | undefined;
    if (t === '(') {
      i++;
      const inner = { factor: 1, dims: {} as Partial<Dims> };
      if (!product(inner)) return false;
      if (toks[i] !== ')') return false;
      i++;
      factor = inner.factor;
      dims = inner.dims;
    } else if (/^[\d.]/.test(t)) {
      factor = Number(t);
      if (!Number.isFinite(factor)) return false;
      i++;
    } else if (/^[a-z]+$/.test(t)) {
      const unit = Object.hasOwn(UNITS, t) ? UNITS[t] : undefined;
      if (!unit) return false;
      factor = unit.factor;
      dims = unit.dims;
      unitName = t;
      i++;
    } else return false;
    let power = 1;
    const next = toks[i];
    const attachedNumber = next !== undefined && /^\d+$/.test(next) && unitName !== undefined;
    if (next === '^' || ((next === '-' || next === '+') && unitName !== undefined && /^\d+$/.test(toks[i + 1] ?? '')) || attachedNumber) {
      const p = exponent();
      if (p === null) return false;
      power = p;
    }
    const k = power * sign;
    acc.factor *= factor ** k;
    for (const [key, v] of Object.entries(dims) as [DimKey, number][]) acc.dims[key] = (acc.dims[key] ?? 0) + v * k;
    if (unitName === 'cm' && k === -1) cmDivided = true;
    if (unitName && UNITS[unitName]!.wavelength && k === -1) wavelengthDivided = true;
    return true;
  };

  const product = (acc: { factor: number; dims: Partial<Dims> }): boolean => {
    if (!term(acc, 1)) return false;
    while (i < toks.length && toks[i] !== ')') {
      let sign = 1;
      if (toks[i] === '/') {
        sign = -1;
        i++;
      } else if (toks[i] === '*' || toks[i] === '.') i++;
      if (!term(acc, sign)) return false;
    }
    return true;
  };

  if (!product(out) || i !== toks.length) return null;
  return { ...out, cmOverWavelength: cmDivided && wavelengthDivided };
}

/**
 * Finds the flux unit a text table states: in the flux column's own name ("flux(1e-17 erg/s/cm2/A)",
 * "f_nu[uJy]") or in a header comment ("flux in mJy", "BUNIT = 'ADU'", "flux is arbitrary units",
 * "units: erg/s/cm^2/A"). Returns the normalised unit, the text it came from, or arbitrary.
 */
export function fluxUnitFromText(columnName: string | undefined, comments: readonly string[]): FluxUnit {
  const candidates: string[] = [];
  const inName = columnName?.match(/[([{](.+)[)\]}]\s*$/);
  if (inName) candidates.push(inName[1]!);
  const stated: string[] = [];
  for (const line of comments) {
    for (const re of [
      /\b(?:bunit|flux[ _-]?units?|funit)\b\s*[:=]?\s*['"]?([^'"#]+?)['"]?\s*$/i,
      /\bflux(?:es)?\b.*?(?:\b(?:in|is|are)\b|[:=[(])\s*(?:units?\s+of\s+)?([^\])]+?)\s*[\])]?\s*\.?$/i,
      /\bunits?\b\s*[:=]\s*(.+?)\s*$/i,
    ]) {
      const m = line.match(re);
      if (m) stated.push(m[1]!.trim());
    }
  }
  candidates.push(...stated);
  for (const c of candidates) {
    const unit = parseFluxUnit(c);
    if (unit && unit.quantity !== 'arbitrary') return unit;
  }
  for (const c of candidates) {
    const unit = parseFluxUnit(c);
    if (unit) return unit;
  }
  return arbitraryFluxUnit(stated[0] ?? inName?.[1] ?? null);
}
