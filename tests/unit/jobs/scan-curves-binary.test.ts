import { describe, expect, it } from 'vitest';
import { decodePackedCurves, decodeScanCurves } from '../../../backend/src/contracts/scan-curves-binary';
import { packCurves } from '../../../backend/src/jobs/scan-curves';

const curves = [
  { template: 'galaxy-emission', class: 'galaxy' as const, z: new Float64Array([0, 0.001, 0.002]), chi2: new Float64Array([1234.5678, 1200.25, 1300]) },
  { template: 'quasar', class: 'quasar' as const, z: new Float64Array([0.5, 0.6]), chi2: new Float64Array([99.5, 100.125]) },
];

describe('packed χ²(z) curves', () => {
  it('decode what packCurves stored, on any byte offset', () => {
    const packed = packCurves(curves as never);
    // Shift by one byte, as SQLite may hand back an unaligned buffer.
    const shifted = new Uint8Array(packed.length + 1);
    shifted.set(packed, 1);
    const decoded = decodePackedCurves(shifted.subarray(1));
    expect(decoded.map((c) => c.template)).toEqual(['galaxy-emission', 'quasar']);
    expect(Array.from(decoded[0]!.chi2)).toEqual([Math.fround(1234.5678), 1200.25, 1300]);
    expect(decodeScanCurves(packed).curves[0]!.z).toEqual([0, 0.001, 0.002]);
    expect(decodeScanCurves(packed).curves[1]!.chi2).toEqual([99.5, 100.125]);
  });

  it('refuse truncated data with a reason rather than reading past the end', () => {
    const packed = packCurves(curves as never);
    expect(() => decodePackedCurves(packed.subarray(0, packed.length - 4))).toThrow(/shorter than their index/);
    expect(() => decodePackedCurves(new Uint8Array(2))).toThrow(/shorter than their 4-byte index length/);
  });
});
