import { num } from './parseHeader';
import type { FitsHdu } from './listHdus';

/**
 * Decodes an image HDU's pixels (big-endian, FITS 4.0 §5) into doubles, applying BSCALE/BZERO;
 * BLANK integers become NaN. Pixels are in FITS order: NAXIS1 varies fastest.
 */
export function readImage(bytes: Uint8Array, hdu: FitsHdu): Float64Array {
  const count = hdu.axes.length === 0 ? 0 : hdu.axes.reduce((a, b) => a * b, 1);
  const out = new Float64Array(count);
  const view = new DataView(bytes.buffer, bytes.byteOffset + hdu.dataOffset, hdu.dataBytes);
  const bscale = num(hdu.header, 'BSCALE') ?? 1;
  const bzero = num(hdu.header, 'BZERO') ?? 0;
  const blank = num(hdu.header, 'BLANK');
  const size = Math.abs(hdu.bitpix) / 8;
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
