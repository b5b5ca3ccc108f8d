import type { BandMapping, FluxUnitName } from '../contracts/targets';
import { nJyFromAb } from '../photoz/photometry';

/** One band of one catalogue row, in nJy for the fit and as the catalogue wrote it. */
export interface BandFlux {
  filter: string;
  fluxNjy: number;
  errNjy: number;
  givenValue: number;
  givenError: number;
  unit: FluxUnitName;
}

/**
 * A magnitude at or beyond this is a non-detection sentinel (99, −99 are the usual ones); its
 * error cell then holds the 1σ limiting magnitude (common practice).
 */
export const MAGNITUDE_SENTINEL = 90;

const EMPTY = /^(|nan|null|none|-|--|n\/a)$/i;
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Magnitude error → flux error: σ_f = f · σ_m · ln 10 / 2.5 (first order; common practice). */
const MAG_TO_FLUX = Math.LN10 / 2.5;

/**
 * Reads a row's band cells into nJy. Both cells empty: the band was not observed (no value).
 * Kept as measurements: zero or negative fluxes with their error (non-detections), and for
 * magnitudes a sentinel ≥ 90 whose error cell is the 1σ limit (flux 0 ± that limit). Refused with
 * a sentence naming the column: one of the pair empty, a cell that is not a number, an error
 * that is not positive.
 */
export function readBandFluxes(record: Record<string, string>, bands: readonly BandMapping[], fail: (column: string, message: string) => void): BandFlux[] {
  const out: BandFlux[] = [];
  for (const band of bands) {
    const fluxCell = (record[band.flux] ?? '').trim();
    const errCell = (record[band.err] ?? '').trim();
    const fluxEmpty = EMPTY.test(fluxCell);
    const errEmpty = EMPTY.test(errCell);
    if (fluxEmpty && errEmpty) continue;
    if (fluxEmpty || errEmpty) {
      const [column, other] = fluxEmpty ? [band.flux, band.err] : [band.err, band.flux];
      fail(column, `Empty while ${other} is given (${band.filter}); leave both cells empty for a band not observed.`);
      continue;
    }
    if (!NUMBER.test(fluxCell)) {
      fail(band.flux, `"${fluxCell.slice(0, 40)}" is not a number (${band.filter}).`);
      continue;
    }
    if (!NUMBER.test(errCell)) {
      fail(band.err, `"${errCell.slice(0, 40)}" is not a number (${band.filter}).`);
      continue;
    }
    const value = Number(fluxCell);
    const error = Number(errCell);
    if (band.unit === 'ABmag') {
      if (Math.abs(value) >= MAGNITUDE_SENTINEL) {
        // Non-detection: the error cell is the 1σ limiting magnitude.
        if (!(error > 0 && error < MAGNITUDE_SENTINEL)) {
          fail(band.err, `The magnitude ${value} marks a non-detection, so this cell must give the 1σ limiting magnitude (got ${errCell}; ${band.filter}).`);
          continue;
        }
        out.push({ filter: band.filter, fluxNjy: 0, errNjy: nJyFromAb(error), givenValue: value, givenError: error, unit: band.unit });
        continue;
      }
      if (!(error > 0)) {
        fail(band.err, `A magnitude error must be positive, got ${errCell} (${band.filter}).`);
        continue;
      }
      const flux = nJyFromAb(value);
      out.push({ filter: band.filter, fluxNjy: flux, errNjy: flux * error * MAG_TO_FLUX, givenValue: value, givenError: error, unit: band.unit });
      continue;
    }
    if (!(error > 0)) {
      fail(band.err, `A flux error must be positive, got ${errCell} (${band.filter}); a non-detection keeps its flux (zero or negative) with its error.`);
      continue;
    }
    const scale = band.unit === 'uJy' ? 1000 : 1;
    out.push({ filter: band.filter, fluxNjy: value * scale, errNjy: error * scale, givenValue: value, givenError: error, unit: band.unit });
  }
  return out;
}

const squash = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

/**
 * Proposes band columns from their names: `flux_<filter>` + `err_<filter>` (nJy),
 * `flux_ujy_<filter>` + `err_ujy_<filter>` (µJy), `mag_<filter>` + `magerr_<filter>` (AB), where
 * <filter> is a known filter name (case and punctuation ignored).
 */
export function guessBandMapping(columns: readonly string[], knownFilters: readonly string[]): BandMapping[] {
  const byKey = new Map(knownFilters.map((f) => [squash(f), f]));
  const cols = new Map(columns.map((c) => [squash(c), c]));
  const out: BandMapping[] = [];
  const patterns: Array<{ flux: string; err: string[]; unit: FluxUnitName }> = [
    { flux: 'fluxujy', err: ['errujy', 'fluxerrujy'], unit: 'uJy' },
    { flux: 'flux', err: ['err', 'fluxerr', 'eflux', 'error'], unit: 'nJy' },
    { flux: 'mag', err: ['magerr', 'emag', 'errmag'], unit: 'ABmag' },
  ];
  const taken = new Set<string>();
  for (const [key, column] of cols) {
    for (const p of patterns) {
      if (!key.startsWith(p.flux) || taken.has(column)) continue;
      const filter = byKey.get(key.slice(p.flux.length));
      if (!filter || out.some((b) => b.filter === filter)) continue;
      const err = p.err.map((e) => cols.get(e + key.slice(p.flux.length))).find((c) => c !== undefined);
      if (!err) continue;
      out.push({ filter, flux: column, err, unit: p.unit });
      taken.add(column).add(err);
    }
  }
  return out;
}
