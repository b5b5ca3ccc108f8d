import { SpectrumReadError } from '../errors';
import { num } from './parseHeader';
import type { FitsHdu } from './listHdus';

/**
 * Decodes an image HDU's pixels (big-endian, FITS 4.0 §5) into doubles, applying BSCALE/BZERO;
 * BLANK integers become NaN. Pixels are in FITS order: NAXIS1 varies fastest. Only the first
 * `maxElements` are decoded when given (a reader that uses the first rows of a 2D image).
 */
export function readImage(bytes: Uint8Array, hdu: FitsHdu, maxElements = Infinity): Float64Array {
  const all = hdu.axes.length === 0 ? 0 : hdu.axes.reduce((a, b) => a * b, 1);
  const count = Math.min(all, maxElements);
  const size = Math.abs(hdu.bitpix) / 8;
  // listHdus checked the header's size against the file; this holds the decoder to the same bytes.
  if (!Number.isSafeInteger(count) || count * size > hdu.dataBytes) {
    throw new SpectrumReadError('fits-size', `HDU ${hdu.index}: NAXIS ${hdu.axes.join(' × ')} of BITPIX ${hdu.bitpix} needs ${count * size} bytes, but the HDU holds ${hdu.dataBytes}.`);
  }
  const out = new Float64Array(count);
  const view = new DataView(bytes.buffer, bytes.byteOffset + hdu.dataOffset, hdu.dataBytes);
  const bscale = num(hdu.header, 'BSCALE') ?? 1;
  const bzero = num(hdu.header, 'BZERO') ?? 0;
  const blank = num(hdu.header, 'BLANK');
  for (let i = 0; i < count; i++) {
    const at = i * size;
    let v: number;
    switch (hdu.bitpix) {
      case 8: v = view.getUint8(at); break;
      case 16: v = view.getInt16(at); break;
      case 32: v = view.getInt32(at); break;
      case 64: v = Number(view.getBigInt64(at)); break;
      case -32: v = view.getFloat32(at); break;
      default: v = view.getFloat64(at);
    }
    out[i] = hdu.bitpix > 0 && blank !== undefined && v === blank ? NaN : v * bscale + bzero;
  }
  return out;
}
