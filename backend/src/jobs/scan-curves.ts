import type { ScanCurve } from '../spectra/scanSpectrum';

/**
 * χ²(z) curves packed for storage: a little JSON index, then float32 z and χ² arrays. float32
 * keeps 7 significant digits — ample for plotting and for locating minima — at half the size.
 *
 * Layout: uint32 LE index length | index JSON (utf-8) | padding to 4 bytes | per curve z[n], chi2[n]
 */
export function packCurves(curves: ScanCurve[]): Buffer {
  const index = JSON.stringify(curves.map((c) => ({ template: c.template, class: c.class, n: c.z.length })));
  const indexBytes = Buffer.from(index, 'utf8');
  const headerLength = 4 + indexBytes.length;
  const padded = headerLength + ((4 - (headerLength % 4)) % 4);
  const total = padded + curves.reduce((sum, c) => sum + c.z.length * 8, 0);
  const out = Buffer.alloc(total);
  out.writeUInt32LE(indexBytes.length, 0);
  indexBytes.copy(out, 4);
  let offset = padded;
  for (const c of curves) {
    const z = new Float32Array(out.buffer, out.byteOffset + offset, c.z.length);
    z.set(c.z);
    offset += c.z.length * 4;
    const chi2 = new Float32Array(out.buffer, out.byteOffset + offset, c.chi2.length);
    chi2.set(c.chi2);
    offset += c.chi2.length * 4;
  }
  return out;
}

/** Read back with `decodePackedCurves` (contracts/scan-curves-binary.ts), shared with the client. */
