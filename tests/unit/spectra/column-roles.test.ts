import { describe, expect, it } from 'vitest';
import { columnPreference, columnRole } from '../../../backend/src/spectra/columnRoles';
import { readSpectrum } from '../../../backend/src/spectra/readSpectrum';

describe('column roles of telluric-corrected near-infrared tables', () => {
  it('a telluric-corrected flux and error are flux and error; a transmission column is nothing', () => {
    expect(columnRole('FLUX_TELL_CORR')).toBe('flux');
    expect(columnRole('ERR_FLUX_TELL_CORR')).toBe('error');
    expect(columnRole('TELLURIC')).toBeUndefined();
    expect(columnRole('ATM_TRANSMISSION')).toBeUndefined();
    expect(columnRole('FLUX_NOCORR')).toBe('flux');
  });

  it('prefers corrected over plain over uncorrected', () => {
    expect(columnPreference('FLUX_TELL_CORR')).toBeGreaterThan(columnPreference('FLUX'));
    expect(columnPreference('FLUX')).toBeGreaterThan(columnPreference('FLUX_NOCORR'));
  });

  it('a text table with FLUX and FLUX_TELL_CORR is read from the corrected pair', () => {
    const rows = ['WAVE,FLUX,ERR_FLUX,FLUX_TELL_CORR,ERR_FLUX_TELL_CORR'];
    for (let i = 0; i < 50; i++) rows.push(`${13000 + i},${i % 2 ? 0.1 : 5},0.5,${2 + 0.01 * i},0.1`);
    const s = readSpectrum(new TextEncoder().encode(rows.join('\n')));
    expect(s.meta.columns).toMatchObject({ flux: 'FLUX_TELL_CORR', error: 'ERR_FLUX_TELL_CORR' });
    expect(s.flux[10]).toBeCloseTo(2.1, 6);
    expect(s.ivar[10]).toBeCloseTo(100, 3);
  });
});
