import { describe, expect, it } from 'vitest';
import { formatBytes, formatCount, formatDateTime, formatDegrees, formatRedshift, formatRedshiftError, formatRedshiftRange, formatTolerance } from './format';

describe('format', () => {
  it('writes the agreement tolerance in dz/(1+z) as set by the lead', () => {
    expect(formatTolerance(0.003)).toBe('|Δz|/(1+z) ≤ 0.003');
  });

  it('writes the searched redshift range', () => {
    expect(formatRedshiftRange(0, 9)).toBe('0 ≤ z ≤ 9');
    expect(formatRedshiftRange(2.5, 7.25)).toBe('2.5 ≤ z ≤ 7.25');
  });

  it('writes times in UTC', () => {
    expect(formatDateTime('2026-12-04T23:23:12.000Z')).toBe('2026-12-04 23:23 UTC');
    expect(formatDateTime(null)).toBe('—');
  });
});

describe('ingest formats', () => {
  it('writes file sizes in decimal units', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(1_500)).toBe('1.50 kB');
    expect(formatBytes(23_400_000)).toBe('23.4 MB');
    expect(formatBytes(2_000_000_000)).toBe('2.00 GB');
  });

  it('writes positions and redshifts to 5 decimals', () => {
    expect(formatDegrees(150.1)).toBe('150.10000');
    expect(formatDegrees(-2.123456)).toBe('-2.12346');
    expect(formatDegrees(null)).toBe('—');
    expect(formatRedshift(3.1234567)).toBe('3.12346');
    expect(formatRedshiftError(0.000261)).toBe('0.00026');
    expect(formatRedshiftError(0.000001)).toBe('< 0.00001');
  });

  it('groups thousands with a thin space', () => {
    expect(formatCount(999)).toBe('999');
    expect(formatCount(12345)).toBe('12\u2009345');
  });
});
