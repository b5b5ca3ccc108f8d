import { describe, expect, it } from 'vitest';
import { FilterCurveError, parseFilterCurve } from '../../../backend/src/photoz/filterCurve';

const good = ['# my campaign filter', '4000 0', '4100 0.2', '4200, 0.9', '4300\t0.85  # plateau', '', '4400 0.1', '4500 0'].join('\n');

function refusal(text: string): FilterCurveError {
  try {
    parseFilterCurve(text, 'mine');
  } catch (e) {
    expect(e).toBeInstanceOf(FilterCurveError);
    return e as FilterCurveError;
  }
  throw new Error('the curve was accepted');
}

describe('parseFilterCurve', () => {
  it('reads two columns with comments, blank lines, commas and tabs', () => {
    const c = parseFilterCurve(good, 'mine');
    expect(c.name).toBe('mine');
    expect(Array.from(c.wavelength)).toEqual([4000, 4100, 4200, 4300, 4400, 4500]);
    expect(Array.from(c.transmission)).toEqual([0, 0.2, 0.9, 0.85, 0.1, 0]);
  });

  it('refuses a non-positive wavelength, naming the line', () => {
    const e = refusal(good.replace('4000 0', '0 0'));
    expect(e.line).toBe(2);
    expect(e.message).toMatch(/line 2: wavelength 0 must be positive/);
    expect(refusal(good.replace('4000 0', '-4000 0')).message).toMatch(/line 2/);
  });

  it('refuses wavelengths that do not strictly increase, naming both lines', () => {
    const e = refusal(good.replace('4300\t0.85', '4200\t0.85'));
    expect(e.line).toBe(5);
    expect(e.message).toMatch(/line 5: wavelength 4200 Å does not increase on line 4/);
  });

  it('refuses a transmission outside [0, 1.5] and hints at per cent', () => {
    expect(refusal(good.replace('4200, 0.9', '4200, 90')).message).toMatch(/line 4: transmission 90 is outside \[0, 1\.5\] \(a curve in per cent/);
    expect(refusal(good.replace('4100 0.2', '4100 -0.01')).line).toBe(3);
    expect(parseFilterCurve(good.replace('4200, 0.9', '4200, 1.5'), 'mine').transmission[2]).toBe(1.5);
  });

  it('refuses non-numbers, infinities and lines with the wrong number of fields', () => {
    expect(refusal(good.replace('4100 0.2', '4100 abc')).message).toMatch(/line 3 is not two numbers/);
    expect(refusal(good.replace('4100 0.2', 'Infinity 0.2')).line).toBe(3);
    expect(refusal(good.replace('4100 0.2', '4100 0.2 7')).message).toMatch(/line 3 has 3 fields/);
    expect(refusal(good.replace('4100 0.2', '4100')).message).toMatch(/line 3 has 1 field \("4100"\)/);
  });

  it('refuses too few samples and an all-zero curve', () => {
    expect(refusal('4000 0\n4100 1\n4200 0\n').message).toMatch(/3 samples; a filter curve needs at least 5/);
    expect(refusal('').message).toMatch(/0 samples/);
    expect(refusal('1 0\n2 0\n3 0\n4 0\n5 0\n').message).toMatch(/every transmission is zero/);
  });
});
