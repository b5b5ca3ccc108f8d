import { describe, expect, it } from 'vitest';
import { classFamily, parseManifest, readManifest, splitHalf, withinTolerance } from '../../../backend/src/validation/realSpectraSplit';

describe('splitHalf: tuning/validation halves by sha-256 of the file name', () => {
  it('keeps named files in their half (first byte of sha-256: 166, 1, 195; checked with node:crypto)', () => {
    expect(splitHalf('sdss/spec-0266-51602-0001.fits')).toBe('tuning');
    expect(splitHalf('highz_xqr30/PSOJ231-20_NIR.fits')).toBe('validation');
    expect(splitHalf('stars/Kesseli2017_L3.fits')).toBe('validation');
  });

  it('is deterministic and splits many names roughly in half', () => {
    const names = Array.from({ length: 2000 }, (_, i) => `survey/spec-${String(i).padStart(5, '0')}.fits`);
    const first = names.map(splitHalf);
    expect(names.map(splitHalf)).toEqual(first);
    const tuning = first.filter((h) => h === 'tuning').length;
    // Binomial(2000, ½): σ ≈ 22, so 900–1100 is a 4.5σ band.
    expect(tuning).toBeGreaterThan(900);
    expect(tuning).toBeLessThan(1100);
  });

  const manifest = readManifest();
  it.skipIf(!manifest)('splits the real MANIFEST.tsv into two halves of 40–60 % each', () => {
    const halves = manifest!.map((r) => splitHalf(r.file));
    const tuning = halves.filter((h) => h === 'tuning').length;
    expect(tuning / halves.length).toBeGreaterThan(0.4);
    expect(tuning / halves.length).toBeLessThan(0.6);
  });
});

describe('parseManifest, classFamily, withinTolerance', () => {
  const text = 'file\tsource_repo\tsource_path\tcommit\tobject_class\treference_z\tz_source\tnotes\treliable\ttolerance\n' +
    'a.fits\tr\tp\tc\tQSO/BROADLINE\t2.5\tpaper\t\tyes\t0.05abs\n' +
    'b.fits\tr\tp\tc\tSKY\tnone\tpipeline\tsky fibre\tno\t0.002rel\n';

  it('reads rows, "none" redshifts as NaN and the reliable flag', () => {
    const rows = parseManifest(text);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({ file: 'a.fits', objectClass: 'QSO/BROADLINE', referenceZ: 2.5, reliable: true, tolerance: '0.05abs' });
    expect(rows[1]!.referenceZ).toBeNaN();
    expect(rows[1]!.reliable).toBe(false);
  });

  it('refuses a row with a bad tolerance, naming the line', () => {
    expect(() => parseManifest(text.replace('0.05abs', '5%'))).toThrowError(/line 2.*tolerance "5%"/);
  });

  it('maps object classes to families; non-sources have none', () => {
    expect(classFamily('GALAXY_TEMPLATE/elliptical')).toBe('galaxy');
    expect(classFamily('QSO_COMPOSITE')).toBe('quasar');
    expect(classFamily('STAR/M3III (44478)')).toBe('star');
    expect(classFamily('LBG/MS1512-cB58')).toBe('lyman-break');
    expect(classFamily('SKY')).toBeUndefined();
    expect(classFamily('DOC')).toBeUndefined();
  });

  it('applies relative and absolute tolerances', () => {
    expect(withinTolerance({ referenceZ: 1, tolerance: '0.002rel' }, 1.0039)).toBe(true);
    expect(withinTolerance({ referenceZ: 1, tolerance: '0.002rel' }, 1.0041)).toBe(false);
    expect(withinTolerance({ referenceZ: 6, tolerance: '0.05abs' }, 6.049)).toBe(true);
    expect(withinTolerance({ referenceZ: 6, tolerance: '0.05abs' }, 6.051)).toBe(false);
  });
});
