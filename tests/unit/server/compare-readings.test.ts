import { describe, expect, it } from 'vitest';
import { DEFAULT_GRADE_SCHEME } from '../../../backend/src/contracts/grades';
import { combineReadings, compareReadings } from '../../../backend/src/release/compare-readings';

// Grades of the default scheme: sure, likely, possible, no-z, unusable (one step apart each).
const reading = (z: number, grade: string, zErr: number | null = null, spectrumClass = 'galaxy', lines: string[] = []) => ({ z, zErr, grade, spectrumClass, lines });

describe('compareReadings', () => {
  it('agrees within the tolerance in dz/(1+z), grades one step apart, same class', () => {
    // |1.000 − 1.005| / (1 + 1.0025) = 0.0024969 ≤ 0.003
    const r = compareReadings(reading(1.0, 'sure'), reading(1.005, 'likely'), DEFAULT_GRADE_SCHEME, 0.003);
    expect(r.agree).toBe(true);
    expect(r.dzOver1pz).toBeCloseTo(0.0024969, 6);
    expect(r.gradeSteps).toBe(1);
  });

  it('names every failed test', () => {
    // |1.0 − 1.01| / 2.005 = 0.0049875 > 0.003; 'sure' and 'possible' are two steps apart; classes differ
    const r = compareReadings(reading(1.0, 'sure'), reading(1.01, 'possible', null, 'quasar'), DEFAULT_GRADE_SCHEME, 0.003);
    expect(r.agree).toBe(false);
    expect(r.reasons).toEqual(['z', 'grade', 'class']);
  });

  it('refuses a grade the scheme does not have', () => {
    expect(() => compareReadings(reading(1, 'sure'), reading(1, '4'), DEFAULT_GRADE_SCHEME, 0.003)).toThrow(/Grade 4 is not/);
  });
});

describe('combineReadings', () => {
  it('takes the inverse-variance mean when both readings give an error', () => {
    // w = 1/0.001² = 1e6 and 1/0.002² = 2.5e5: z = (1e6·2.000 + 2.5e5·2.004)/1.25e6 = 2.0008, σ = 1/√1.25e6 = 8.944e-4
    const c = combineReadings(reading(2.0, 'sure', 0.001, 'galaxy', ['H-alpha']), reading(2.004, 'likely', 0.002, 'galaxy', ['[O III] 5008', 'H-alpha']), DEFAULT_GRADE_SCHEME);
    expect(c.z).toBeCloseTo(2.0008, 10);
    expect(c.zErr).toBeCloseTo(8.94427e-4, 8);
    expect(c.grade).toBe('likely');
    expect(c.lines).toEqual(['H-alpha', '[O III] 5008']);
  });

  it('otherwise takes the more confident reading, or the mean of equal grades', () => {
    expect(combineReadings(reading(0.5, 'likely'), reading(0.501, 'sure'), DEFAULT_GRADE_SCHEME)).toMatchObject({ z: 0.501, grade: 'likely' });
    expect(combineReadings(reading(0.5, 'sure'), reading(0.501, 'sure'), DEFAULT_GRADE_SCHEME).z).toBeCloseTo(0.5005, 12);
  });
});
