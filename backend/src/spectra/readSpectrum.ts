import { gunzipSync } from 'fflate';
import { SpectrumReadError } from './errors';
import { readFitsSpectrum, type ReadOptions } from './readFitsSpectrum';
import { readTextSpectrum } from './readTextSpectrum';
import type { Spectrum } from './types';

/** Deflate cannot expand data by more than about 1032:1; larger claims are corrupt or hostile. */
const MAX_GZIP_RATIO = 1100;
const MAX_UNZIPPED = 1 << 30;

/**
 * Reads spectrum bytes of any supported kind: gzip is unwrapped first, then FITS is recognised by
 * its first card ("SIMPLE  ="), anything else is tried as a text table. Always returns a Spectrum
 * or throws SpectrumReadError.
 *
 * @param bytes the whole file
 * @param options caller overrides (medium)
 */
export function readSpectrum(bytes: Uint8Array, options: ReadOptions = {}): Spectrum {
  if (bytes.length === 0) throw new SpectrumReadError('empty-file', 'The file is empty.');
  let data = bytes;
  if (bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b) data = gunzip(bytes);
  if (isFits(data)) return readFitsSpectrum(data, options);
  return readTextSpectrum(data, options);
}

function isFits(bytes: Uint8Array): boolean {
  const sig = 'SIMPLE  =';
  if (bytes.length < sig.length) return false;
  for (let i = 0; i < sig.length; i++) if (bytes[i] !== sig.charCodeAt(i)) return false;
  return true;
}

function gunzip(bytes: Uint8Array): Uint8Array {
  if (bytes.length < 18) throw new SpectrumReadError('gzip', 'The gzip stream is shorter than its own header and trailer.');
  const n = bytes.length;
  const claimed = (bytes[n - 4]! | (bytes[n - 3]! << 8) | (bytes[n - 2]! << 16) | (bytes[n - 1]! << 24)) >>> 0;
  if (claimed > Math.min(MAX_UNZIPPED, n * MAX_GZIP_RATIO)) {
    throw new SpectrumReadError('gzip', `The gzip trailer claims ${claimed} uncompressed bytes, impossible for ${n} compressed bytes.`);
  }
  try {
    return gunzipSync(bytes, { out: new Uint8Array(claimed) });
  } catch (e) {
    throw new SpectrumReadError('gzip', `The gzip stream is corrupt: ${(e as Error).message}.`);
  }
}
