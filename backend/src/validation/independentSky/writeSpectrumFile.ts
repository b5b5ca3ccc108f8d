/**
 * Writes a generated spectrum as a file of one of four layouts, each declaring its wavelength medium
 * the way the readers look for it (backend/src/spectra/readFitsSpectrum.ts, readTextSpectrum.ts):
 * FITS image: CTYPE1 WAVE/AWAV (linear) or WAVE-LOG/AWAV-LOG, or DC-FLAG = 1 with AIRORVAC;
 * FITS binary table: a WAVE/AWAV column plus VACUUM or AIRORVAC; text: "vacuum"/"air" in a comment.
 * The FITS writer is our own (FITS Standard 4.0: 2880-byte blocks, 80-character cards, big-endian).
 */
export type FileLayout = 'fits-image' | 'fits-table' | 'csv' | 'text';

/** Pixel axis of a FITS image: constant Δλ or constant Δ log λ. */
export type ImageAxis = { kind: 'linear'; start: number; step: number } | { kind: 'wave-log'; start: number; step: number } | { kind: 'log10'; start: number; step: number };

export interface WrittenSpectrum {
  /** Wavelength of each pixel centre in the declared medium, Å (for images: exactly the axis). */
  wavelength: Float64Array;
  flux: Float64Array;
  /** 1σ per pixel; omitted in some text files (the reader estimates it). */
  error?: Float64Array;
  sky?: Float64Array;
  medium: 'vacuum' | 'air';
  axis?: ImageAxis;
  /** Text files: wavelength unit written (Å or nm). */
  unit?: 'angstrom' | 'nm';
  object: string;
}

const BLOCK = 2880;

function card(key: string, value: string | number | boolean, comment = ''): string {
  let v: string;
  if (typeof value === 'string') v = `'${value.replace(/'/g, "''").padEnd(8)}'`.padEnd(20);
  else if (typeof value === 'boolean') v = (value ? 'T' : 'F').padStart(20);
  else v = (Number.isInteger(value) && Math.abs(value) < 1e15 ? String(value) : value.toExponential(13).toUpperCase()).padStart(20);
  const text = `${key.padEnd(8)}= ${v}${comment ? ` / ${comment}` : ''}`;
  return text.slice(0, 80).padEnd(80);
}

function header(cards: string[]): Uint8Array {
  const all = [...cards, 'END'.padEnd(80)];
  const text = all.join('').padEnd(Math.ceil((all.length * 80) / BLOCK) * BLOCK);
  return new TextEncoder().encode(text);
}

function float32Data(arrays: Float64Array[]): Uint8Array {
  const n = arrays.reduce((s, a) => s + a.length, 0);
  const out = new Uint8Array(Math.ceil((4 * n) / BLOCK) * BLOCK);
  const view = new DataView(out.buffer);
  let k = 0;
  for (const a of arrays) for (const v of a) view.setFloat32(4 * k++, v);
  return out;
}

function concat(parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((s, p) => s + p.length, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

/** A 1D float32 image with the WCS of `s.axis`, and the error as an image extension EXTNAME ERROR. */
function fitsImage(s: WrittenSpectrum): Uint8Array {
  const axis = s.axis;
  if (!axis) throw new RangeError('A FITS image needs its pixel axis.');
  const n = s.flux.length;
  const air = s.medium === 'air';
  const wcs: string[] = axis.kind === 'log10'
    ? [card('CRVAL1', axis.start, 'log10 of the first wavelength, Angstrom'), card('CDELT1', axis.step), card('CRPIX1', 1), card('CTYPE1', 'LINEAR'), card('DC-FLAG', 1, 'log-linear axis'), card('AIRORVAC', air ? 'air' : 'vac')]
    : [card('CRVAL1', axis.start), card('CDELT1', axis.step), card('CRPIX1', 1), card('CTYPE1', `${air ? 'AWAV' : 'WAVE'}${axis.kind === 'wave-log' ? '-LOG' : ''}`), card('CUNIT1', 'Angstrom')];
  const primary = header([
    card('SIMPLE', true), card('BITPIX', -32), card('NAXIS', 1), card('NAXIS1', n), card('EXTEND', true),
    ...wcs, card('BUNIT', '1e-17 erg/s/cm2/A'), card('OBJECT', s.object),
  ]);
  const parts = [primary, float32Data([s.flux])];
  if (s.error) {
    parts.push(header([card('XTENSION', 'IMAGE'), card('BITPIX', -32), card('NAXIS', 1), card('NAXIS1', n), card('PCOUNT', 0), card('GCOUNT', 1), card('EXTNAME', 'ERROR')]));
    parts.push(float32Data([s.error]));
  }
  return concat(parts);
}

/** An empty primary HDU and a binary table: wavelength as float64, the rest float32. */
function fitsTable(s: WrittenSpectrum): Uint8Array {
  const air = s.medium === 'air';
  const cols: Array<{ name: string; data: Float64Array; double: boolean; unit?: string }> = [
    { name: air ? 'AWAV' : 'WAVE', data: s.wavelength, double: true, unit: 'Angstrom' },
    { name: 'FLUX', data: s.flux, double: false },
  ];
  if (s.error) cols.push({ name: 'IVAR', data: Float64Array.from(s.error, (e) => (e > 0 ? 1 / (e * e) : 0)), double: false });
  if (s.sky) cols.push({ name: 'SKY', data: s.sky, double: false });
  const n = s.flux.length;
  const width = cols.reduce((w, c) => w + (c.double ? 8 : 4), 0);
  const cards = [
    card('XTENSION', 'BINTABLE'), card('BITPIX', 8), card('NAXIS', 2), card('NAXIS1', width), card('NAXIS2', n),
    card('PCOUNT', 0), card('GCOUNT', 1), card('TFIELDS', cols.length),
  ];
  cols.forEach((c, k) => {
    cards.push(card(`TTYPE${k + 1}`, c.name), card(`TFORM${k + 1}`, c.double ? '1D' : '1E'));
    if (c.unit) cards.push(card(`TUNIT${k + 1}`, c.unit));
  });
  cards.push(air ? card('AIRORVAC', 'air') : card('VACUUM', true, 'vacuum wavelengths'), card('OBJECT', s.object));
  const data = new Uint8Array(Math.ceil((width * n) / BLOCK) * BLOCK);
  const view = new DataView(data.buffer);
  for (let r = 0; r < n; r++) {
    let at = r * width;
    for (const c of cols) {
      if (c.double) view.setFloat64(at, c.data[r]!);
      else view.setFloat32(at, c.data[r]!);
      at += c.double ? 8 : 4;
    }
  }
  const primary = header([card('SIMPLE', true), card('BITPIX', 8), card('NAXIS', 0), card('EXTEND', true)]);
  return concat([primary, header(cards), data]);
}

/** CSV with a header line, or whitespace columns named in the last comment line. */
function textTable(s: WrittenSpectrum, csv: boolean): Uint8Array {
  const nm = s.unit === 'nm';
  const factor = nm ? 0.1 : 1;
  const mediumWord = s.medium === 'air' ? 'standard air' : 'vacuum';
  const lines = [
    `# independent-sky spectrum ${s.object}`,
    `# wavelengths in ${nm ? 'nanometres' : 'Angstrom'}, ${mediumWord}; flux density in 1e-17 erg/s/cm2/A`,
  ];
  const names = [nm ? 'wave(nm)' : 'wavelength', 'flux', ...(s.error ? ['error'] : [])];
  if (csv) lines.push(names.join(','));
  else lines.push(`# ${names.join(' ')}`);
  const sep = csv ? ',' : '  ';
  for (let i = 0; i < s.flux.length; i++) {
    const row = [(s.wavelength[i]! * factor).toFixed(nm ? 5 : 4), s.flux[i]!.toPrecision(7)];
    if (s.error) row.push(s.error[i]!.toPrecision(6));
    lines.push(row.join(sep));
  }
  return new TextEncoder().encode(`${lines.join('\n')}\n`);
}

/** The file bytes of `s` in `layout`. */
export function writeSpectrumFile(s: WrittenSpectrum, layout: FileLayout): Uint8Array {
  if (layout === 'fits-image') return fitsImage(s);
  if (layout === 'fits-table') return fitsTable(s);
  return textTable(s, layout === 'csv');
}
