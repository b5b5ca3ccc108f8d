import { describe, expect, it } from 'vitest';
import { formatDateTime, formatRedshiftRange, formatTolerance } from './format';

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
