import { readFileSync } from 'node:fs';
import { eq } from 'drizzle-orm';
import { spectra } from '../db/schema';
import { AppError } from '../http/errors';
import { SpectrumReadError } from '../spectra/errors';
import { readSpectrum } from '../spectra/readSpectrum';
import { PACKING_VERSION } from '../storage/pack-spectrum';
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

/**
 * A spectrum's arrays for plotting, packed (storage/pack-spectrum.ts describes the layout). The
 * stored file is read for a cache miss: what is plotted is exactly what was uploaded. Misses are
 * parsed and packed on the spectrum-data thread, so a cold file does not hold the web thread;
 * two requests missing the same file at once share one packing.
 */
export async function packSpectrumData(ctx: ServiceContext, spectrumId: number): Promise<PackedSpectrumData> {
  const row = ctx.db.select({ sha256: spectra.sha256, fileName: spectra.fileName }).from(spectra).where(eq(spectra.id, spectrumId)).get()!;
  const etag = `"${row.sha256}-v${PACKING_VERSION}"`;
  const cache = packedCache(ctx);
  const cached = cache.get(row.sha256);
  if (cached) return { packed: cached, etag };
  const packing = inFlight(ctx);
  let pending = packing.get(row.sha256);
  if (!pending) {
    pending = packOffThread(ctx, row).finally(() => packing.delete(row.sha256));
    packing.set(row.sha256, pending);
  }
  const packed = await pending;
  cache.set(row.sha256, packed);
  return { packed, etag };
}

const inFlight = perContext<ServiceContext, Map<string, Promise<Buffer>>>(() => new Map());

async function packOffThread(ctx: ServiceContext, row: { sha256: string; fileName: string }): Promise<Buffer> {
  try {
    return await ctx.spectrumData.pack(ctx.store.pathOf(row.sha256));
  } catch (err) {
    throw unreadable(err, row.fileName);
  }
}

/** A stored spectrum file read again; a file that no longer reads is a 422 naming it, never a 500. */
export function readStoredSpectrum(ctx: ServiceContext, row: { sha256: string; fileName: string }) {
  try {
    return readSpectrum(readFileSync(ctx.store.pathOf(row.sha256)));
  } catch (err) {
    throw unreadable(err, row.fileName);
  }
}

function unreadable(err: unknown, fileName: string): unknown {
  return err instanceof SpectrumReadError ? new AppError(422, 'spectrum_unreadable', `${fileName} can no longer be read: ${err.message}`) : err;
}
