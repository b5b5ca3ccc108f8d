import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { REAL_SPECTRA_DIR } from '../realSpectraSplit';

/**
 * The real spectra the independent sky borrows shapes from (KC96 galaxy composites, Kesseli 2017
 * and SpeX cool-dwarf standards), read by a minimal FITS reader of its own: the engine's readers
 * are what the sky tests, so it must not lean on them.
 */
export interface RealSed {
  /** Vacuum wavelength, Å, increasing. */
  wavelength: Float64Array;
  flux: Float64Array;
}

interface Hdu { cards: Map<string, string | number | boolean>; dataStart: number; dataBytes: number }

function listHdus(bytes: Uint8Array): Hdu[] {
  const hdus: Hdu[] = [];
  let off = 0;
  const text = new TextDecoder('latin1');
  while (off + 2880 <= bytes.length) {
    const cards = new Map<string, string | number | boolean>();
    let ended = false;
    while (!ended && off + 2880 <= bytes.length) {
      const block = text.decode(bytes.subarray(off, off + 2880));
      off += 2880;
      for (let i = 0; i < 36; i++) {
        const card = block.slice(80 * i, 80 * i + 80);
        const key = card.slice(0, 8).trim();
        if (key === 'END') { ended = true; break; }
        if (card.slice(8, 10) !== '= ') continue;
        const raw = card.slice(10).trim();
        if (raw.startsWith("'")) cards.set(key, raw.slice(1, raw.indexOf("'", 1)).trim());
        else {
          const v = raw.split('/')[0]!.trim();
          cards.set(key, v === 'T' ? true : v === 'F' ? false : Number(v));
        }
      }
    }
    const naxis = Number(cards.get('NAXIS') ?? 0);
    let n = naxis > 0 ? 1 : 0;
    for (let k = 1; k <= naxis; k++) n *= Number(cards.get(`NAXIS${k}`));
    const dataBytes = (n * Math.abs(Number(cards.get('BITPIX'))) / 8) + Number(cards.get('PCOUNT') ?? 0);
    hdus.push({ cards, dataStart: off, dataBytes });
    off += Math.ceil(dataBytes / 2880) * 2880;
  }
  return hdus;
}

/** Scalar columns of a binary table with TFORM E or D, by TTYPE name. */
function tableColumns(bytes: Uint8Array, hdu: Hdu): Map<string, Float64Array> {
  const view = new DataView(bytes.buffer, bytes.byteOffset);
  const rowBytes = Number(hdu.cards.get('NAXIS1'));
  const rows = Number(hdu.cards.get('NAXIS2'));
  const out = new Map<string, Float64Array>();
  let offset = 0;
  for (let k = 1; k <= Number(hdu.cards.get('TFIELDS')); k++) {
    const form = String(hdu.cards.get(`TFORM${k}`)).trim();
    const m = /^(\d*)([EDJIB])$/.exec(form);
    if (!m) throw new RangeError(`TFORM${k} = ${form}: only scalar E, D, J, I, B columns are read here.`);
    const size = { E: 4, D: 8, J: 4, I: 2, B: 1 }[m[2] as 'E'];
    const repeat = m[1] === '' ? 1 : Number(m[1]);
    if (repeat === 1 && (m[2] === 'E' || m[2] === 'D')) {
      const col = new Float64Array(rows);
      for (let r = 0; r < rows; r++) {
        const at = hdu.dataStart + r * rowBytes + offset;
        col[r] = m[2] === 'E' ? view.getFloat32(at) : view.getFloat64(at);
      }
      out.set(String(hdu.cards.get(`TTYPE${k}`)).trim().toLowerCase(), col);
    }
    offset += size * repeat;
  }
  return out;
}

function finite(wavelength: Float64Array, flux: Float64Array): RealSed {
  const keep: number[] = [];
  for (let i = 0; i < wavelength.length; i++) {
    if (Number.isFinite(wavelength[i]!) && Number.isFinite(flux[i]!) && (keep.length === 0 || wavelength[i]! > wavelength[keep[keep.length - 1]!]!)) keep.push(i);
  }
  return { wavelength: Float64Array.from(keep, (i) => wavelength[i]!), flux: Float64Array.from(keep, (i) => flux[i]!) };
}

function read(file: string): Uint8Array {
  return new Uint8Array(readFileSync(join(REAL_SPECTRA_DIR, file)));
}

/**
 * A Kinney–Calzetti (1996) rest-frame composite (HDU 1: WAVELENGTH Å, FLUX f_λ). The file does not
 * say air or vacuum; taken as vacuum because the engine, reading it as air, puts the elliptical and
 * S0 at z = +0.0003 to +0.0004, the air–vacuum factor (measured on the real-spectra table). Not
 * settled: on the independent sky the engine finds these galaxies 110–160 km/s low (median), which
 * would fit air wavelengths (−84 km/s) plus template mismatch. Either way ≤ 0.0005 in Δz/(1 + z).
 */
export function readKc96(name: 'elliptical' | 's0' | 'bulge' | 'sa'): RealSed {
  const bytes = read(`composites/KC96_${name}_template.fits`);
  const cols = tableColumns(bytes, listHdus(bytes)[1]!);
  return finite(cols.get('wavelength')!, cols.get('flux')!);
}

/** A Kesseli et al. (2017) SDSS-based dwarf standard: HDU 1 LogLam (log10 Å, vacuum as SDSS), Flux. */
export function readKesseli(file: string): RealSed {
  const bytes = read(`stars/${file}`);
  const cols = tableColumns(bytes, listHdus(bytes)[1]!);
  const log = cols.get('loglam')!;
  return finite(Float64Array.from(log, (v) => 10 ** v), cols.get('flux')!);
}

/**
 * A SpeX prism standard: a 3-row float image (wavelength µm, flux, error). At R ≈ 120 the air or
 * vacuum question (3·10⁻⁴) is a thirtieth of a pixel, so it is taken as vacuum.
 */
export function readSpex(file: string): RealSed {
  const bytes = read(`stars/${file}`);
  const hdu = listHdus(bytes)[0]!;
  const n = Number(hdu.cards.get('NAXIS1'));
  const bitpix = Number(hdu.cards.get('BITPIX'));
  const view = new DataView(bytes.buffer, bytes.byteOffset);
  const at = (row: number, i: number) => (bitpix === -32 ? view.getFloat32(hdu.dataStart + 4 * (row * n + i)) : view.getFloat64(hdu.dataStart + 8 * (row * n + i)));
  const w = new Float64Array(n);
  const f = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    w[i] = at(0, i) * 1e4;
    f[i] = at(1, i);
  }
  return finite(w, f);
}

/** Linear interpolation of a SED at λ (Å); 0 outside its range. */
export function sedAt(sed: RealSed, lambda: number, hint = { i: 0 }): number {
  const w = sed.wavelength;
  if (lambda < w[0]! || lambda > w[w.length - 1]!) return 0;
  let i = Math.min(hint.i, w.length - 2);
  while (i > 0 && w[i]! > lambda) i--;
  while (i < w.length - 2 && w[i + 1]! < lambda) i++;
  hint.i = i;
  const t = (lambda - w[i]!) / (w[i + 1]! - w[i]!);
  return sed.flux[i]! * (1 - t) + sed.flux[i + 1]! * t;
}
