import type { LineMeasurementView } from '@contracts/line-measurements';
import { describe, expect, it } from 'vitest';
import { measurementText } from './measurement-text';

const base: LineMeasurementView = {
  name: 'H-alpha', rest: 6564.607, observed: 7221.07, kind: 'emission', blendedWith: [], measure: 'flux', measured: true, note: null,
  flux: 7.934e-17, fluxErr: 1.07e-17, ewRest: 4.6, ewRestErr: 0.7, breakRatio: null, breakRatioErr: null, snr: 7.4, offsetKms: 50, offsetErrKms: 12, coverage: 1, detected: true,
};

describe('measurementText', () => {
  it('writes the deciding quantity with its error and unit', () => {
    expect(measurementText(base, 'erg s⁻¹ cm⁻²')).toBe('7.93e-17 ± 1.07e-17 erg s⁻¹ cm⁻²');
    expect(measurementText({ ...base, flux: 12.34, fluxErr: 1.5 }, 'arbitrary × Å')).toBe('12.3 ± 1.5 arbitrary × Å');
    expect(measurementText({ ...base, kind: 'absorption', measure: 'ew', ewRest: -2.512, ewRestErr: 0.41 }, 'x')).toBe('EW -2.51 ± 0.41 Å');
    expect(measurementText({ ...base, kind: 'break', measure: 'break', breakRatio: 1.634, breakRatioErr: 0.0412 }, 'x')).toBe('ratio 1.63 ± 0.0412');
  });

  it('says why a line has no measurement', () => {
    expect(measurementText({ ...base, measured: false, note: 'a pixel in the core of the line is masked or unusable' }, 'x')).toBe('a pixel in the core of the line is masked or unusable');
    expect(measurementText({ ...base, kind: 'break', measure: 'break', breakRatio: null, breakRatioErr: null }, 'x')).toBe('break: no flux measured blueward');
  });
});
