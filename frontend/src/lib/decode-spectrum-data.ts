import type { FluxUnitView } from '@contracts/spectra';

/** A spectrum's arrays as served by GET /api/spectra/:id/data (vacuum wavelengths). */
export interface SpectrumArrays {
  pixels: number;
  /** Vacuum Å, increasing. */
  wavelength: Float64Array;
  flux: Float32Array;
  /** 1σ in flux units; NaN where unknown. */
  error: Float32Array;
  /** 1 = bad pixel. */
  mask: Uint8Array;
  sky: Float32Array | null;
  convertedFromAir: boolean;
  /** The file's flux unit, normalised; null or 'arbitrary' when the file states none Redward reads. */
  fluxUnit: FluxUnitView | null;
}

interface Header {
  pixels: number;
  sky: boolean;
  medium: string;
  convertedFromAir: boolean;
  fluxUnit: FluxUnitView | null;
}

type Ctor<T> = { new (buffer: ArrayBuffer, byteOffset: number, length: number): T; new (length: number): T; BYTES_PER_ELEMENT: number };

/** A view when the offset is aligned for the element size; otherwise a copy (typed arrays need alignment). */
function viewOrCopy<T extends Float64Array | Float32Array>(C: Ctor<T>, buffer: ArrayBuffer, offset: number, n: number): T {
  if (offset % C.BYTES_PER_ELEMENT === 0) return new C(buffer, offset, n);
  const out = new C(n);
  new Uint8Array(out.buffer).set(new Uint8Array(buffer, offset, n * C.BYTES_PER_ELEMENT));
  return out;
}

/**
 * Decodes: uint32 LE header length | header JSON | pad to 8 | float64 λ[n] | float32 flux[n] |
 * float32 error[n] | uint8 mask[n] | (sky) pad to 4, float32 sky[n]. Throws a sentence when short.
 */
export function decodeSpectrumData(buffer: ArrayBuffer): SpectrumArrays {
  if (buffer.byteLength < 4) throw new RangeError('The answer is shorter than its header length field.');
  const headerLength = new DataView(buffer).getUint32(0, true);
  if (4 + headerLength > buffer.byteLength) throw new RangeError('The header runs past the end of the answer.');
  const header = JSON.parse(new TextDecoder().decode(new Uint8Array(buffer, 4, headerLength))) as Header;
  const n = header.pixels;
  let offset = 4 + headerLength;
  offset += (8 - (offset % 8)) % 8;
  const need = offset + n * (8 + 4 + 4 + 1) + (header.sky ? n * 4 + 3 : 0);
  if (buffer.byteLength < need - (header.sky ? 3 : 0)) throw new RangeError(`Expected ${n} pixels but the answer holds ${buffer.byteLength} bytes.`);
  const wavelength = viewOrCopy(Float64Array, buffer, offset, n);
  offset += n * 8;
  const flux = viewOrCopy(Float32Array, buffer, offset, n);
  offset += n * 4;
  const error = viewOrCopy(Float32Array, buffer, offset, n);
  offset += n * 4;
  const mask = new Uint8Array(buffer, offset, n);
  offset += n;
  let sky: Float32Array | null = null;
  if (header.sky) {
    offset += (4 - (offset % 4)) % 4;
    sky = viewOrCopy(Float32Array, buffer, offset, n);
  }
  return { pixels: n, wavelength, flux, error, mask, sky, convertedFromAir: header.convertedFromAir, fluxUnit: header.fluxUnit };
}
