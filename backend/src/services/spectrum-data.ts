import { readFileSync } from 'node:fs';
import { eq } from 'drizzle-orm';
import { spectra } from '../db/schema';
import { AppError } from '../http/errors';
import { SpectrumReadError } from '../spectra/errors';
import { readSpectrum } from '../spectra/readSpectrum';
import { toVacuumArray } from '../spectra/toVacuum';
import { ByteLru, perContext } from './byte-lru';
import type { ServiceContext } from './context';

/**
 * Packed arrays by the stored file's sha-256. A stored file never changes (uploads are addressed
 * by content and never overwritten), so neither does its packing: reading and parsing a FITS file
 * on every request cost ≈ 50 ms of the web thread's time under load (issue 13's load benchmark).
 * 128 MB holds ≈ 1,900 spectra of 4,000 pixels — a busy campaign's working set.
 */
export const SPECTRUM_DATA_CACHE_BYTES = 128 * 1024 * 1024;
const packedCache = perContext<ServiceContext, ByteLru<Buffer>>(() => new ByteLru(SPECTRUM_DATA_CACHE_BYTES));

export interface PackedSpectrumData {
  packed: Buffer;
  /** A strong validator for the answer: the stored file's hash and the packing's version. */
  etag: string;
}

/** Bump when the packing below changes, so that browsers holding an old answer fetch the new one. */
const PACKING_VERSION = 1;

/**
 * A spectrum's arrays for plotting, packed compactly:
 *   uint32 LE header length | header JSON | pad to 8 | float64 wavelength[n] (vacuum Å) |
 *   float32 flux[n] | float32 error[n] (1σ; NaN where unknown) | uint8 mask[n] | float32 sky[n] if header.sky
 * Wavelengths stay float64 so a comb placed to 5 decimals in z lands on the right pixel.
 * The stored file is read each time: what is plotted is exactly what was uploaded.
 */
export function packSpectrumData(ctx: ServiceContext, spectrumId: number): PackedSpectrumData {
  const row = ctx.db.select({ sha256: spectra.sha256, fileName: spectra.fileName }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
  const etag = `"${row.sha256}-v${PACKING_VERSION}"`;
  const cache = packedCache(ctx);
  const cached = cache.get(row.sha256);
  if (cached) return { packed: cached, etag };
  const packed = packStoredFile(ctx, row);
  cache.set(row.sha256, packed);
  return { packed, etag };
}

/** A stored spectrum file read again; a file that no longer reads is a 422 naming it, never a 500. */
export function readStoredSpectrum(ctx: ServiceContext, row: { sha256: string; fileName: string }) {
  try {
    return readSpectrum(readFileSync(ctx.store.pathOf(row.sha256)));
  } catch (err) {
    if (err instanceof SpectrumReadError) throw new AppError(422, 'spectrum_unreadable', `${row.fileName} can no longer be read: ${err.message}`);
    throw err;
  }
}

function packStoredFile(ctx: ServiceContext, row: { sha256: string; fileName: string }): Buffer {
  const spectrum = readStoredSpectrum(ctx, row);
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
