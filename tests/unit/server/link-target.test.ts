import { describe, expect, it } from 'vitest';
import { angularSeparationArcsec, linkTarget } from '../../../backend/src/ingest/link-target';

const targets = [
  { id: 1, catalogueId: 'LNT-12', ra: 160.5, dec: -11.63 },
  { id: 2, catalogueId: 'LNT-123', ra: 160.51, dec: -11.64 },
  { id: 3, catalogueId: 'TDF-7a', ra: null, dec: null },
];

describe('linkTarget', () => {
  it('matches the catalogue id as a whole token of the file name, longest first', () => {
    expect(linkTarget(targets, { fileName: 'night2/LNT-123_grism.fits' }, 2)).toEqual({ targetId: 2, method: 'file-name' });
    expect(linkTarget(targets, { fileName: 'lnt-12.csv' }, 2)).toEqual({ targetId: 1, method: 'file-name' });
    expect(linkTarget(targets, { fileName: 'LNT-1234.csv' }, 2)).toBeNull();
  });

  it('falls back to the OBJECT keyword, then to position', () => {
    expect(linkTarget(targets, { fileName: 'spec0001.fits', objectName: 'tdf-7A' }, 2)).toEqual({ targetId: 3, method: 'object-keyword' });
    const near = linkTarget(targets, { fileName: 'spec0002.fits', ra: 160.5 + 0.5 / 3600, dec: -11.63 }, 2);
    expect(near?.targetId).toBe(1);
    expect(near?.method).toBe('position');
    // 0.5″ of RA at Dec −11.63° is 0.5 × cos(11.63°) = 0.4897″ on the sky.
    expect(near?.separationArcsec).toBeCloseTo(0.4897, 3);
    expect(linkTarget(targets, { fileName: 'spec0003.fits', ra: 161, dec: -11.63 }, 2)).toBeNull();
  });
});

describe('angularSeparationArcsec', () => {
  it('gives one degree along a meridian and shrinks RA offsets by cos(Dec)', () => {
    expect(angularSeparationArcsec(10, 20, 10, 21)).toBeCloseTo(3600, 6);
    expect(angularSeparationArcsec(0, 60, 1, 60)).toBeCloseTo(1800, 0);
  });
});
