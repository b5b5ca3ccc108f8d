import { DEFAULT_GRADE_SCHEME } from '@contracts/grades';
import { describe, expect, it } from 'vitest';
import { gradeForKey, gradeRank, gradeText } from './grade-label';

const digits = [
  { code: '4', label: 'firm', meaning: '' },
  { code: '3', label: 'probable', meaning: '' },
  { code: '0', label: 'unusable', meaning: '' },
];

describe('grade labels and keys', () => {
  it('reads word codes by their label and digit codes as before', () => {
    expect(gradeText(DEFAULT_GRADE_SCHEME, 'sure')).toBe('sure');
    expect(gradeText(DEFAULT_GRADE_SCHEME, 'no-z')).toBe('no redshift (no-z)');
    expect(gradeText(digits, '4')).toBe('4 firm');
    expect(gradeText(digits, 'x')).toBe('x (not in the grade scheme)');
  });

  it('ranks by place in the scheme, most confident first', () => {
    expect(gradeRank(DEFAULT_GRADE_SCHEME, 'sure')).toBe(0);
    expect(gradeRank(DEFAULT_GRADE_SCHEME, 'unusable')).toBe(4);
    expect(gradeRank(DEFAULT_GRADE_SCHEME, 'nope')).toBe(5);
  });

  it('a digit key is the grade at that place, or the grade with that digit code in older schemes', () => {
    expect(gradeForKey(DEFAULT_GRADE_SCHEME, 1)).toBe('sure');
    expect(gradeForKey(DEFAULT_GRADE_SCHEME, 3)).toBe('possible');
    expect(gradeForKey(DEFAULT_GRADE_SCHEME, 6)).toBeNull();
    expect(gradeForKey(DEFAULT_GRADE_SCHEME, 0)).toBeNull();
    expect(gradeForKey(digits, 4)).toBe('4');
    expect(gradeForKey(digits, 0)).toBe('0');
    expect(gradeForKey(digits, 1)).toBe('4');
  });
});
