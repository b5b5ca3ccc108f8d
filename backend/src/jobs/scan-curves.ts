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

export interface StoredCurve {
  template: string;
  class: ScanCurve['class'];
  z: Float32Array;
  chi2: Float32Array;
}

export function unpackCurves(packed: Uint8Array): StoredCurve[] {
  const view = Buffer.from(packed.buffer, packed.byteOffset, packed.byteLength);
  const indexLength = view.readUInt32LE(0);
  const index = JSON.parse(view.subarray(4, 4 + indexLength).toString('utf8')) as { template: string; class: ScanCurve['class']; n: number }[];
  const headerLength = 4 + indexLength;
  let offset = headerLength + ((4 - (headerLength % 4)) % 4);
  // Copy out of the buffer: SQLite hands back buffers whose offset need not be 4-aligned.
  const floats = (n: number) => {
    const arr = new Float32Array(n);
    new Uint8Array(arr.buffer).set(view.subarray(offset, offset + n * 4));
    offset += n * 4;
    return arr;
  };
  return index.map((entry) => ({ template: entry.template, class: entry.class, z: floats(entry.n), chi2: floats(entry.n) }));
}
