import type { FluxUnitView } from '@contracts/spectra';
import { decimalsFor, niceStep } from './rest-frame-axis';

/** How the flux axis reads: tick value = file value × `factor`, in the unit the label names. */
export interface FluxAxis {
  factor: number;
  label: string;
}

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };
const power = (e: number) => `10${String(e).replace(/./g, (c) => SUPERSCRIPT[c] ?? c)}`;
const JY_PREFIX: Record<number, string> = { 0: 'Jy', [-3]: 'mJy', [-6]: 'µJy', [-9]: 'nJy' };
const QUANTITY: Record<FluxUnitView['quantity'], string> = {
  'f-lambda': 'Flux density f_λ',
  'f-nu': 'Flux density f_ν',
  counts: 'Counts',
  'count-rate': 'Count rate',
  arbitrary: 'Flux',
};

/** Tick labels stay short when the shown numbers lie in [0.01, 10⁴). */
const readable = (peak: number) => peak >= 1e-2 && peak < 1e4;

/**
 * The flux axis of a spectrum from its unit and the size of its flux (`peak`, e.g. the larger
 * end of its robust range, in file units). Numbers far from 1 are scaled by a power of ten named
 * in the label (×10⁻¹⁷), so an axis of 10⁻¹⁷ values gets readable ticks; a file's own readable
 * scale is kept (SDSS's "10⁻¹⁷ erg s⁻¹ cm⁻² Å⁻¹"). A spectrum without a unit says "arbitrary
 * units": a unit is never assumed.
 *
 * @example fluxAxis({ quantity: 'f-lambda', scale: 1, unit: 'erg s⁻¹ cm⁻² Å⁻¹', raw: 'erg/s/cm2/A' }, 3e-17).label // 'Flux density f_λ (10⁻¹⁷ erg s⁻¹ cm⁻² Å⁻¹)'
 */
export function fluxAxis(unit: FluxUnitView | null, peak: number): FluxAxis {
  const size = Math.abs(peak);
  const known = unit !== null && unit.quantity !== 'arbitrary';
  if (!known) {
    if (!Number.isFinite(size) || size === 0 || readable(size)) return { factor: 1, label: 'Flux (arbitrary units)' };
    const e = Math.floor(Math.log10(size));
    return { factor: 10 ** -e, label: `Flux (arbitrary units, ×${power(e)})` };
  }
  const name = QUANTITY[unit.quantity];
  const fileExponent = Math.log10(unit.scale);
  // The file's own scale reads well and is a power of ten: its numbers as they are.
  if (Number.isFinite(size) && size > 0 && readable(size) && Number.isInteger(Math.round(fileExponent * 1e9) / 1e9) && unit.quantity !== 'f-nu') {
    const e = Math.round(fileExponent);
    return { factor: 1, label: `${name} (${e === 0 ? '' : `${power(e)} `}${unit.unit})` };
  }
  const physical = size * unit.scale;
  if (!Number.isFinite(physical) || physical === 0) return { factor: unit.scale, label: `${name} (${unit.unit})` };
  let e = Math.floor(Math.log10(physical));
  if (unit.quantity === 'f-nu') {
    // Flux densities in Jy read in their SI prefixes: mJy, µJy, nJy.
    e = Math.max(-9, Math.min(0, Math.floor(e / 3) * 3));
    return { factor: unit.scale * 10 ** -e, label: `${name} (${JY_PREFIX[e]})` };
  }
  if (readable(physical)) e = 0;
  return { factor: unit.scale * 10 ** -e, label: `${name} (${e === 0 ? '' : `${power(e)} `}${unit.unit})` };
}

/**
 * Tick positions (in file units) for the flux range [min, max] that fall on round numbers of the
 * axis as shown (value × factor), about `targetTicks` of them, with their labels. Computed in
 * shown units, so 10⁻¹⁷-sized data get the same ticks as numbers near 1.
 */
export function fluxTicks(min: number, max: number, factor: number, targetTicks: number): { splits: number[]; labels: string[] } {
  const lo = Math.min(min, max) * factor;
  const hi = Math.max(min, max) * factor;
  if (!(hi > lo) || !Number.isFinite(lo) || !Number.isFinite(hi)) return { splits: [], labels: [] };
  const step = niceStep((hi - lo) / Math.max(2, targetTicks));
  const d = decimalsFor(step);
  const splits: number[] = [];
  const labels: string[] = [];
  for (let k = Math.ceil(lo / step); k * step <= hi + step * 1e-9; k++) {
    const shown = k * step;
    splits.push(shown / factor);
    labels.push(k === 0 ? '0' : shown.toFixed(d));
  }
  return { splits, labels };
}
