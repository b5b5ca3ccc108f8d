import type { ScanCurves } from './spectra';

/**
 * The packed χ²(z) curves as the server stores them and serves them (GET /api/spectra/:id/scan-curves,
 * application/octet-stream): uint32 LE index length | index JSON (utf-8, [{template, class, n}]) |
 * padding to 4 bytes | per curve float32 LE z[n], then float32 LE χ²[n].
 * Serving the stored bytes as they are costs the server nothing; JSON of ≈ 40,000 numbers cost
 * ≈ 45 ms of the web thread per request (issue 13's load benchmark). Shared by server and client.
 */
export interface PackedCurve {
  template: string;
  class: string;
  z: Float32Array;
  chi2: Float32Array;
}

export function decodePackedCurves(packed: Uint8Array | ArrayBuffer): PackedCurve[] {
  const bytes = packed instanceof Uint8Array ? packed : new Uint8Array(packed);
  if (bytes.byteLength < 4) throw new Error(`the curves are ${bytes.byteLength} bytes long, shorter than their 4-byte index length`);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const indexLength = view.getUint32(0, true);
  if (4 + indexLength > bytes.byteLength) throw new Error('the curves index runs past the end of the data');
  const index = JSON.parse(new TextDecoder().decode(bytes.subarray(4, 4 + indexLength))) as { template: string; class: string; n: number }[];
  const headerLength = 4 + indexLength;
  let offset = headerLength + ((4 - (headerLength % 4)) % 4);
  // Copied out: the bytes need not sit on a 4-byte boundary (SQLite's buffers, a sliced response).
  const floats = (n: number) => {
    if (offset + n * 4 > bytes.byteLength) throw new Error('the curves are shorter than their index says');
    const arr = new Float32Array(n);
    new Uint8Array(arr.buffer).set(bytes.subarray(offset, offset + n * 4));
    offset += n * 4;
    return arr;
  };
  return index.map((entry) => ({ template: entry.template, class: entry.class, z: floats(entry.n), chi2: floats(entry.n) }));
}

/** The curves as plain arrays for plotting: z to 6 decimals, χ² to 7 significant digits (float32's). */
export function decodeScanCurves(packed: Uint8Array | ArrayBuffer): ScanCurves {
  return {
    curves: decodePackedCurves(packed).map((c) => ({
      template: c.template,
      class: c.class,
      z: Array.from(c.z, (v) => Number(v.toFixed(6))),
      chi2: Array.from(c.chi2, (v) => Number(v.toPrecision(7))),
    })),
  };
}
