import type { Spectrum } from '../spectra/types';
import { toVacuumArray } from '../spectra/toVacuum';

/** Bump when the packing below changes, so that browsers holding an old answer fetch the new one. */
export const PACKING_VERSION = 1;

/**
 * A spectrum's arrays for plotting, packed compactly:
 *   uint32 LE header length | header JSON | pad to 8 | float64 wavelength[n] (vacuum Å) |
 *   float32 flux[n] | float32 error[n] (1σ; NaN where unknown) | uint8 mask[n] | float32 sky[n] if header.sky
 * Wavelengths stay float64 so a comb placed to 5 decimals in z lands on the right pixel.
 */
export function packSpectrum(spectrum: Spectrum): Buffer {
  const n = spectrum.wavelength.length;
  const wavelength = spectrum.meta.medium === 'air' ? toVacuumArray(spectrum.wavelength) : spectrum.wavelength;
  const header = Buffer.from(
    JSON.stringify({ pixels: n, sky: spectrum.sky !== undefined, medium: 'vacuum', convertedFromAir: spectrum.meta.medium === 'air', fluxUnit: spectrum.fluxUnit }),
    'utf8',
  );
  const headerEnd = 4 + header.length;
  const start = headerEnd + ((8 - (headerEnd % 8)) % 8);
  const size = start + n * 8 + n * 4 * 2 + n + (spectrum.sky ? n * 4 : 0) + 8;
  const out = Buffer.alloc(size);
  out.writeUInt32LE(header.length, 0);
  header.copy(out, 4);
  let offset = start;
  new Float64Array(out.buffer, out.byteOffset + offset, n).set(wavelength);
  offset += n * 8;
  new Float32Array(out.buffer, out.byteOffset + offset, n).set(spectrum.flux);
  offset += n * 4;
  const error = new Float32Array(out.buffer, out.byteOffset + offset, n);
  for (let i = 0; i < n; i++) error[i] = spectrum.ivar[i]! > 0 ? 1 / Math.sqrt(spectrum.ivar[i]!) : Number.NaN;
  offset += n * 4;
  out.set(spectrum.mask, offset);
  offset += n;
  if (spectrum.sky) {
    offset += (4 - (offset % 4)) % 4;
    new Float32Array(out.buffer, out.byteOffset + offset, n).set(spectrum.sky);
    offset += n * 4;
  }
  return out.subarray(0, offset);
}
