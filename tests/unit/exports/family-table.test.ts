import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { familyTable } from '../../../backend/src/exports/familyTable';
import { familyTableCsv } from '../../../backend/src/exports/familyTableCsv';
import { toCsv } from '../../../backend/src/exports/toCsv';
import { ASSUMPTIONS, row } from './sample';

describe('familyTable', () => {
  const rows = [
    // Family A: z 3.000 and 3.004 → spread 0.004/4.002 ≈ 0.0009995, within 0.002.
    row({ id: 1, targetId: 'A.1', imageFamily: 'A', z: 3.0 }),
    row({ id: 2, targetId: 'A.2', imageFamily: 'A', z: 3.004 }),
    // Family B: z 2.0 and 2.1 → spread 0.1/3.05 ≈ 0.0328, beyond 0.002.
    row({ id: 3, targetId: 'B.1', imageFamily: 'B', z: 2.0 }),
    row({ id: 4, targetId: 'B.2', imageFamily: 'B', z: 2.1 }),
    // B.2 was corrected: record 5 supersedes 4 and agrees with B.1.
    row({ id: 5, targetId: 'B.2', imageFamily: 'B', z: 2.001, supersedes: 4 }),
    row({ id: 6, targetId: 'C.1', imageFamily: 'C', z: 1.5 }),
    row({ id: 7, targetId: 'field', imageFamily: null, z: 0.7 }),
  ];

  it('computes mean and spread (max − min)/(1 + mean), and flags disagreement beyond the tolerance', () => {
    const t = familyTable(rows.slice(0, 4), 0.002);
    expect(t.map((f) => f.family)).toEqual(['A', 'B']);
    expect(t[0]!.meanZ).toBeCloseTo(3.002, 12);
    expect(t[0]!.spread).toBeCloseTo(0.004 / 4.002, 12);
    expect(t[0]!.flagged).toBe(false);
    expect(t[1]!.spread).toBeCloseTo(0.1 / 3.05, 12);
    expect(t[1]).toMatchObject({ discrepant: true, incomplete: false, flagged: true });
  });

  it('leaves superseded records out, so a correction can resolve a discrepant family', () => {
    const b = familyTable(rows, 0.002).find((f) => f.family === 'B')!;
    expect(b.members.map((m) => m.recordId)).toEqual([3, 5]);
    expect(b.discrepant).toBe(false);
  });

  it('flags a family with an unconfirmed image, including one with no confirmed member at all', () => {
    const t = familyTable(rows, 0.002, [
      { imageFamily: 'C', targetId: 'C.2', spectrumId: 40 },
      { imageFamily: 'D', targetId: 'D.1', spectrumId: null },
    ]);
    expect(t.find((f) => f.family === 'C')).toMatchObject({ incomplete: true, flagged: true, spread: 0 });
    expect(t.find((f) => f.family === 'D')).toMatchObject({ meanZ: null, spread: null, incomplete: true, flagged: true });
    expect(t.some((f) => f.family === 'field')).toBe(false);
  });

  it('writes CSV with the CSV export conventions, readable by papaparse', () => {
    const csv = familyTableCsv(familyTable(rows, 0.002, [{ imageFamily: 'D', targetId: null, spectrumId: 41 }]), ASSUMPTIONS);
    expect(csv).toMatch(/^# Redward image families\n# campaign: /);
    const parsed = Papa.parse<Record<string, string>>(csv, { comments: '#', header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.find((r) => r.image_family === 'B')).toMatchObject({ n_confirmed: '2', discrepant: 'False', members: 'B.1:2;B.2:2.001' });
    expect(parsed.data.find((r) => r.image_family === 'D')).toMatchObject({ z_mean: '', spread: '', incomplete: 'True', unconfirmed: 'spectrum 41' });
  });
});

describe('export input is checked once, with a sentence', () => {
  it('refuses a non-flat cosmology, a non-finite z and an unknown class', () => {
    expect(() => toCsv([row()], { ...ASSUMPTIONS, cosmology: { ...ASSUMPTIONS.cosmology, omegaLambda: 0.7 } })).toThrow(/must be flat/);
    expect(() => toCsv([row({ z: Number.NaN })], ASSUMPTIONS)).toThrow(/Confirmed record 101: z must be a finite number/);
    expect(() => toCsv([row({ spectrumClass: 'comet' as never })], ASSUMPTIONS)).toThrow(/class 'comet'/);
    expect(() => familyTable([row()], -1)).toThrow(RangeError);
  });
});
