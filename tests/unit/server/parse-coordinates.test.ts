import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseDec, parseRa } from '../../../backend/src/ingest/parse-coordinates';

describe('parseRa', () => {
  it('reads decimal degrees and sexagesimal hours', () => {
    // 10h42m03.5s = (10 + 42/60 + 3.5/3600) × 15° = 160.5145833…°
    expect(parseRa('10:42:03.5')).toBeCloseTo(160.5145833, 6);
    expect(parseRa('10 42 03.5')).toBeCloseTo(160.5145833, 6);
    expect(parseRa('10h42m03.5s')).toBeCloseTo(160.5145833, 6);
    expect(parseRa('160.5146')).toBe(160.5146);
  });

  it('refuses values outside the circle or malformed', () => {
    expect(parseRa('360')).toBeNull();
    expect(parseRa('24:00:00')).toBeNull();
    expect(parseRa('10:61:00')).toBeNull();
    expect(parseRa('-10:00:00')).toBeNull();
    expect(parseRa('ten')).toBeNull();
    expect(parseRa('')).toBeNull();
  });
});

describe('parseDec', () => {
  it('keeps the sign for declinations just south of the equator', () => {
    expect(parseDec('-00:30:00')).toBe(-0.5);
    expect(parseDec('−11:38:00')).toBeCloseTo(-11.633333, 6);
    expect(parseDec('+45d30m00s')).toBe(45.5);
    expect(parseDec('-89.99')).toBe(-89.99);
  });

  it('refuses values beyond the poles', () => {
    expect(parseDec('91')).toBeNull();
    expect(parseDec('-90:00:01')).toBeNull();
  });

  it('inverts its own sexagesimal formatting to better than 0.01″ for any declination', () => {
    fc.assert(
      fc.property(fc.double({ min: -89.9999, max: 89.9999, noNaN: true }), (deg) => {
        const sign = deg < 0 ? '-' : '+';
        const a = Math.abs(deg);
        const d = Math.floor(a);
        const m = Math.floor((a - d) * 60);
        const s = (a - d - m / 60) * 3600;
        const text = `${sign}${d}:${String(m).padStart(2, '0')}:${s.toFixed(4).padStart(7, '0')}`;
        expect(Math.abs(parseDec(text)! - deg) * 3600).toBeLessThan(0.01);
      }),
    );
  });
});
