import { SpectrumReadError } from '../errors';
import { num, parseHeader, str, type FitsHeader } from './parseHeader';

export type HduKind = 'image' | 'bintable' | 'other';

/** One header-data unit located in the file; data are not decoded yet. */
export interface FitsHdu {
  index: number;
  kind: HduKind;
  header: FitsHeader;
  /** Axis lengths NAXIS1..NAXISn. */
  axes: number[];
  bitpix: number;
  dataOffset: number;
  /** Bytes of data actually present (before padding). */
  dataBytes: number;
}

const MAX_HDUS = 64;

/**
 * Walks the HDUs of a FITS file (FITS 4.0 §3–§7). Data sizes come from BITPIX, NAXISn, PCOUNT and
 * GCOUNT and are checked against the bytes present before anything is allocated, so a header that
 * claims NAXIS1 = 10¹² fails with a sentence instead of an allocation. A missing final padding
 * block is tolerated because several archives write files that way.
 */
export function listHdus(bytes: Uint8Array): FitsHdu[] {
  const hdus: FitsHdu[] = [];
  let offset = 0;
  while (offset < bytes.length && hdus.length < MAX_HDUS) {
    const index = hdus.length;
    // Trailing zero or blank padding after the last HDU is common; stop quietly there.
    if (index > 0 && !startsWith(bytes, offset, 'XTENSION')) break;
    const header = parseHeader(bytes, offset, index);
    if (index === 0 && header.values.get('SIMPLE') === undefined) {
      throw new SpectrumReadError('fits-header', 'HDU 0: the first card is not SIMPLE, so this is not a FITS file.');
    }
    const bitpix = num(header, 'BITPIX');
    if (bitpix === undefined || ![8, 16, 32, 64, -32, -64].includes(bitpix)) {
      throw new SpectrumReadError('fits-header', `HDU ${index}: BITPIX is ${String(header.values.get('BITPIX'))}, not one of 8, 16, 32, 64, -32, -64.`);
    }
    const naxis = num(header, 'NAXIS');
    if (naxis === undefined || !Number.isInteger(naxis) || naxis < 0 || naxis > 999) {
      throw new SpectrumReadError('fits-header', `HDU ${index}: NAXIS is missing or not an integer between 0 and 999.`);
    }
    const axes: number[] = [];
    for (let k = 1; k <= naxis; k++) {
      const n = num(header, `NAXIS${k}`);
      if (n === undefined || !Number.isInteger(n) || n < 0) {
        throw new SpectrumReadError('fits-header', `HDU ${index}: NAXIS${k} is missing or not a non-negative integer.`);
      }
      axes.push(n);
    }
    const pcount = num(header, 'PCOUNT') ?? 0;
    const gcount = num(header, 'GCOUNT') ?? 1;
    if (pcount < 0 || gcount < 0 || !Number.isInteger(pcount) || !Number.isInteger(gcount)) {
      throw new SpectrumReadError('fits-header', `HDU ${index}: PCOUNT/GCOUNT must be non-negative integers.`);
    }
    const xtension = str(header, 'XTENSION')?.trim().toUpperCase();
    const kind: HduKind = index === 0 || xtension === 'IMAGE' ? 'image' : xtension === 'BINTABLE' ? 'bintable' : 'other';
    // FITS 4.0 §4.4.1.2, §7.1.1, §7.3.1: images and binary tables have GCOUNT = 1, images PCOUNT = 0.
    // Another value changes the size of the data, so the byte count below would not be the reader's.
    // (A primary array with NAXIS1 = 0 is random groups, which we do not read but may skip.)
    const groups = index === 0 && axes[0] === 0;
    if (kind !== 'other' && !groups && gcount !== 1) {
      throw new SpectrumReadError('fits-header', `HDU ${index}: GCOUNT = ${gcount}, but ${kind === 'image' ? 'an image' : 'a binary table'} must have GCOUNT = 1.`);
    }
    if (kind === 'image' && !groups && pcount !== 0) {
      throw new SpectrumReadError('fits-header', `HDU ${index}: PCOUNT = ${pcount}, but an image must have PCOUNT = 0.`);
    }
    let elements = naxis === 0 ? 0 : 1;
    for (const n of axes) elements *= n;
    const claimed = (Math.abs(bitpix) / 8) * gcount * (pcount + elements);
    const dataOffset = offset + header.byteLength;
    const remaining = bytes.length - dataOffset;
    if (!Number.isFinite(claimed) || claimed > remaining) {
      throw new SpectrumReadError(
        'fits-size',
        `HDU ${index}: the header claims ${claimed} data bytes (NAXIS ${axes.join(' × ')}) but only ${remaining} bytes remain in the file.`,
      );
    }
    hdus.push({ index, kind, header, axes, bitpix, dataOffset, dataBytes: claimed });
    offset = dataOffset + Math.ceil(claimed / 2880) * 2880;
  }
  return hdus;
}

function startsWith(bytes: Uint8Array, offset: number, text: string): boolean {
  if (offset + text.length > bytes.length) return false;
  for (let i = 0; i < text.length; i++) if (bytes[offset + i] !== text.charCodeAt(i)) return false;
  return true;
}
