import { SpectrumReadError } from './errors';
import { angstromsPer, columnPreference, columnRole, guessAngstromsPer, type ColumnRole } from './columnRoles';
import { finishSpectrum, type RawColumns } from './finishSpectrum';
import { imageWavelengths } from './fits/imageWavelengths';
import { listHdus, type FitsHdu } from './fits/listHdus';
import { str, type FitsHeader } from './fits/parseHeader';
import { readBinaryTable, type TableColumn } from './fits/readBinaryTable';
import { readImage } from './fits/readImage';
import type { Medium, Spectrum, SpectrumMeta } from './types';
import { checkPixelCount, checkWavelengths } from './spectrumLimits';

/** Rows of a 2D image looked at for flux, error, mask and sky (IRAF multispec layouts use ≤ 4). */
const MAX_IMAGE_ROWS = 16;

/** Caller choices that override what the file says. */
export interface ReadOptions {
  /** Force the wavelength medium (the file may be silent or wrong). */
  medium?: Medium;
}

/**
 * Reads a 1D spectrum from FITS bytes: the first image HDU with a dispersion axis (1D, or 2D
 * with labelled rows such as flux/error/mask, or a row of wavelengths), else the first binary
 * table with a wavelength and a flux column (one value per row, or one row of vectors).
 * Throws SpectrumReadError naming the HDU and keyword when nothing usable is found.
 */
export function readFitsSpectrum(bytes: Uint8Array, options: ReadOptions = {}): Spectrum {
  const hdus = listHdus(bytes);
  const primary = hdus[0]!.header;
  const problems: string[] = [];
  for (const hdu of hdus) {
    if (hdu.kind === 'image' && (hdu.axes[0] ?? 0) > 1) {
      const s = fromImage(bytes, hdus, hdu, primary, options, problems);
      if (s) return s;
    } else if (hdu.kind === 'bintable' && (hdu.axes[1] ?? 0) > 0) {
      const s = fromTable(bytes, hdu, primary, options, problems);
      if (s) return s;
    }
  }
  const why = problems.length > 0 ? ` ${problems.join(' ')}` : '';
  throw new SpectrumReadError('fits-no-spectrum', `No HDU of ${hdus.length} holds a 1D spectrum.${why}`);
}

function baseMeta(header: FitsHeader, primary: FitsHeader, source: string, options: ReadOptions, ctype = ''): Omit<SpectrumMeta, 'errorsEstimated'> {
  const pick = (k: string) => header.values.get(k) ?? primary.values.get(k);
  const s = (k: string) => {
    const v = pick(k);
    return typeof v === 'string' && v.trim() !== '' ? v.trim() : undefined;
  };
  const n = (k: string) => {
    const v = pick(k);
    return typeof v === 'number' ? v : undefined;
  };
  let medium: Medium = 'air';
  let mediumFrom: SpectrumMeta['mediumFrom'] = 'default';
  const vac = pick('VACUUM');
  const airorvac = s('AIRORVAC')?.toLowerCase();
  if (options.medium) {
    medium = options.medium;
    mediumFrom = 'override';
  } else if (ctype.startsWith('AWAV')) {
    mediumFrom = 'header';
  } else if (ctype.startsWith('WAVE')) {
    medium = 'vacuum';
    mediumFrom = 'header';
  } else if (typeof vac === 'boolean') {
    medium = vac ? 'vacuum' : 'air';
    mediumFrom = 'header';
  } else if (airorvac) {
    medium = airorvac.startsWith('vac') ? 'vacuum' : 'air';
    mediumFrom = 'header';
  }
  const meta: Omit<SpectrumMeta, 'errorsEstimated'> = { source, medium, mediumFrom, columns: {}, warnings: [] };
  const objectName = s('OBJECT') ?? s('OBJNAME');
  if (objectName) meta.objectName = objectName;
  // PLUG_RA/PLUG_DEC are the fibre's (the object's) position; RA/DEC there is the plate centre.
  const ra = n('PLUG_RA') ?? n('RA');
  const dec = n('PLUG_DEC') ?? n('DEC');
  if (ra !== undefined) meta.ra = ra;
  if (dec !== undefined) meta.dec = dec;
  const instrument = s('INSTRUME') ?? s('TELESCOP');
  if (instrument) meta.instrument = instrument;
  const exposure = n('EXPTIME') ?? n('EXPOSURE');
  if (exposure !== undefined) meta.exposureS = exposure;
  const mjd = n('MJD-OBS') ?? n('MJD');
  // MJD 40587 is 1970-01-01 (the Unix epoch).
  const date = s('DATE-OBS') ?? (mjd !== undefined && mjd > 0 && mjd < 1e6 ? new Date((mjd - 40587) * 86_400_000).toISOString().slice(0, 10) : undefined);
  if (date) meta.dateObs = date;
  const unit = s('BUNIT') ?? s('FLUXUNIT');
  if (unit) meta.fluxUnit = unit;
  return meta;
}

/** Role of an image row or extension from its label (ARRAYn, BANDIDn, EXTNAME). */
function labelRole(label: string | undefined): ColumnRole | 'ignore' | undefined {
  if (!label) return undefined;
  const l = label.toLowerCase().trim();
  // IRAF labels read like "spectrum - background median, weights variance": the head word decides.
  if (/^(spectrum|flux|sci)/.test(l)) return 'flux';
  if (/continuum|model|cont-sub/.test(l)) return 'ignore';
  if (/ivar|inverse/.test(l)) return 'ivar';
  if (/variance|^var/.test(l)) return 'variance';
  if (/sigma|error|err|noise|unc/.test(l)) return 'error';
  if (/mask|badpix|bpm|quality|flag/.test(l)) return 'mask';
  if (/sky|background/.test(l)) return 'sky';
  if (/wave|lambda/.test(l)) return 'wavelength';
  if (/spectrum|flux|sci|object/.test(l)) return 'flux';
  return undefined;
}

function fromImage(bytes: Uint8Array, hdus: FitsHdu[], hdu: FitsHdu, primary: FitsHeader, options: ReadOptions, problems: string[]): Spectrum | undefined {
  const n = hdu.axes[0]!;
  const rows = hdu.axes.slice(1).reduce((a, b) => a * b, 1);
  checkPixelCount(n, `FITS HDU ${hdu.index} image`, `pixels along NAXIS1`);
  // Rows past the 16th are never looked at (labelled layouts have a handful), so they are not decoded.
  const pixels = readImage(bytes, hdu, Math.min(rows, MAX_IMAGE_ROWS) * n);
  const row = (r: number) => pixels.subarray(r * n, (r + 1) * n);
  const h = hdu.header;
  const ctype = (str(h, 'CTYPE1') ?? '').trim().toUpperCase();
  const raw: Partial<RawColumns> = {};
  const columns: Record<string, string> = {};
  const axisNotes: string[] = [];
  let wavelength = imageWavelengths(h, n, hdu.index, hdu.index === 0 ? undefined : primary, axisNotes);
  const where = `FITS HDU ${hdu.index} image`;
  // Rows: a labelled layout (ARRAYn / BANDIDn) decides; otherwise row 0 is flux, and when no WCS
  // exists a monotonic first row is the wavelength row (flux and error follow).
  let firstFluxRow = 0;
  if (!wavelength && rows >= 2 && isMonotonic(row(0))) {
    const w = row(0);
    const factor = guessAngstromsPer(Math.abs(w[n >> 1]!));
    wavelength = Float64Array.from(w, (v) => v * factor);
    checkWavelengths(wavelength, `FITS HDU ${hdu.index} image`, (i) => `row 0 (wavelengths), pixel ${i + 1}`, w);
    columns.wavelength = 'row 0';
    firstFluxRow = 1;
  }
  if (!wavelength) {
    problems.push(`HDU ${hdu.index}: image without CRVAL1/CDELT1, COEFF0/COEFF1 or a wavelength row.`);
    return undefined;
  }
  for (let r = firstFluxRow; r < Math.min(rows, MAX_IMAGE_ROWS); r++) {
    const label = str(h, `ARRAY${r + 1}`) ?? str(h, `BANDID${r + 1}`);
    let role = labelRole(label);
    if (role === undefined) role = r === firstFluxRow ? 'flux' : r === firstFluxRow + 1 && !label && firstFluxRow === 1 ? 'error' : undefined;
    if (role === 'ignore' || role === undefined || role === 'wavelength' || role === 'logWavelength') continue;
    if (raw[role] === undefined) {
      raw[role] = row(r);
      columns[role] = label ? `row ${r} (${label.trim()})` : `row ${r}`;
    }
  }
  // Companion image extensions of the same length (EXTNAME ERROR, BADPIX, SKY...).
  for (const other of hdus) {
    if (other === hdu || other.kind !== 'image' || other.axes.length !== 1 || other.axes[0] !== n) continue;
    const role = labelRole(str(other.header, 'EXTNAME'));
    if (role && role !== 'ignore' && role !== 'flux' && role !== 'wavelength' && role !== 'logWavelength' && raw[role] === undefined) {
      raw[role] = readImage(bytes, other);
      columns[role] = `HDU ${other.index} (${str(other.header, 'EXTNAME')!.trim()})`;
    }
  }
  if (!raw.flux) {
    problems.push(`HDU ${hdu.index}: no row of the image is labelled as flux.`);
    return undefined;
  }
  const meta = baseMeta(h, primary, where, options, ctype);
  meta.columns = { wavelength: columns.wavelength ?? `WCS axis 1${ctype ? ` (${ctype})` : ''}`, ...columns };
  meta.warnings.push(...axisNotes);
  return finishSpectrum({ ...raw, wavelength, flux: raw.flux } as RawColumns, meta, where);
}

function isMonotonic(v: Float64Array): boolean {
  if (v.length < 3) return false;
  const sign = Math.sign(v[1]! - v[0]!);
  if (sign === 0) return false;
  for (let i = 1; i < v.length; i++) if (!(Math.sign(v[i]! - v[i - 1]!) === sign)) return false;
  return v[0]! > 0;
}

function fromTable(bytes: Uint8Array, hdu: FitsHdu, primary: FitsHeader, options: ReadOptions, problems: string[]): Spectrum | undefined {
  const cols = readBinaryTable(bytes, hdu);
  const rows = hdu.axes[1]!;
  const byRole = new Map<ColumnRole, TableColumn>();
  for (const c of cols) {
    const role = columnRole(c.name);
    const held = role && byRole.get(role);
    if (role && (!held || columnPreference(c.name) > columnPreference(held.name))) byRole.set(role, c);
  }
  const wave = byRole.get('wavelength') ?? byRole.get('logWavelength');
  const flux = byRole.get('flux');
  if (!wave || !flux) {
    problems.push(`HDU ${hdu.index}: binary table has no ${wave ? 'flux' : 'wavelength'} column among ${cols.map((c) => c.name).join(', ') || 'its numeric columns'}.`);
    return undefined;
  }
  const len = wave.values.length;
  if (flux.values.length !== len || (rows > 1 && wave.repeat !== 1)) {
    problems.push(`HDU ${hdu.index}: columns ${wave.name} and ${flux.name} have different lengths.`);
    return undefined;
  }
  const isLog = byRole.get('wavelength') === undefined || (wave.values[len >> 1]! < 5.5 && /log/i.test(wave.name + wave.unit));
  const w = new Float64Array(len);
  if (isLog) {
    for (let i = 0; i < len; i++) w[i] = 10 ** wave.values[i]!;
  } else {
    const factor = angstromsPer(wave.unit) ?? guessAngstromsPer(Math.abs(wave.values[len >> 1]!));
    for (let i = 0; i < len; i++) w[i] = wave.values[i]! * factor;
  }
  const where = `FITS HDU ${hdu.index} binary table`;
  const position = rows > 1 ? (i: number) => `row ${i + 1} of column ${wave.name}` : (i: number) => `element ${i + 1} of column ${wave.name}`;
  checkWavelengths(w, where, position, wave.values);
  const raw: RawColumns = { wavelength: w, flux: flux.values };
  const columns: Record<string, string> = { wavelength: wave.name, flux: flux.name };
  for (const role of ['ivar', 'error', 'variance', 'mask', 'sky'] as const) {
    const c = byRole.get(role);
    if (c && c.values.length === len) {
      raw[role] = c.values;
      columns[role] = c.name;
    }
  }
  // One uncertainty is enough; prefer ivar, then error, then variance.
  if (raw.ivar) {
    delete raw.error;
    delete raw.variance;
  } else if (raw.error) delete raw.variance;
  const ctype = /^a(ir|wav)/i.test(wave.name) ? 'AWAV' : '';
  const meta = baseMeta(hdu.header, primary, where, options, ctype);
  meta.columns = columns;
  // The flux column's own TUNITn is more specific than a BUNIT of the HDU or the primary header.
  if (flux.unit) meta.fluxUnit = flux.unit;
  return finishSpectrum(raw, meta, where);
}
