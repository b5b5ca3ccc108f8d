import { describe, expect, it } from 'vitest';
import { safeFileName } from './safe-file-name';

describe('safeFileName', () => {
  it('keeps the base name of climbing or absolute names', () => {
    expect(safeFileName('../../etc/passwd')).toBe('passwd');
    expect(safeFileName('night1/../../spec_0042.fits')).toBe('spec_0042.fits');
    expect(safeFileName('/home/obs/spec.txt')).toBe('spec.txt');
    expect(safeFileName('C:\\data\\spec.fits')).toBe('spec.fits');
    expect(safeFileName('..\\..\\spec.fits')).toBe('spec.fits');
    expect(safeFileName('../')).toBe('unnamed');
  });

  it('leaves ordinary names and relative folders alone', () => {
    expect(safeFileName('spec_0042.fits')).toBe('spec_0042.fits');
    expect(safeFileName('night1/obj..a.fits')).toBe('night1/obj..a.fits');
    expect(safeFileName('night1/./obj.fits')).toBe('night1/./obj.fits');
  });
});
