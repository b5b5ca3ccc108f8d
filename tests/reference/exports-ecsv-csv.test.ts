import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { parse as parseYaml } from 'yaml';
import { cosmicColumns } from '../../backend/src/exports/cosmicColumns';
import { toCsv } from '../../backend/src/exports/toCsv';
import { toEcsv } from '../../backend/src/exports/toEcsv';
import { ASSUMPTIONS, EXPECTED, ROWS } from '../unit/exports/sample';

type Record_ = Record<string, string>;

/** Splits an ECSV text into its YAML header (with '# ' removed) and its CSV body (APE 6 "Header details"). */
function splitEcsv(text: string) {
  const lines = text.split('\n');
  const first = lines.findIndex((l) => !l.startsWith('#'));
  const header = lines.slice(0, first);
  for (const l of header) expect(l.startsWith('# ')).toBe(true);
  return { header: header.map((l) => l.slice(2)), body: lines.slice(first).join('\n') };
}

const expectedCells = (i: number) => {
  const r = ROWS[i]!;
  return {
    record_id: String(r.id),
    target_id: r.targetId ?? '',
    z: String(EXPECTED[i]!.z),
    z_err: EXPECTED[i]!.zErr === null ? '' : String(EXPECTED[i]!.zErr),
    z_err_floor: r.zErrFloor === null ? '' : String(r.zErrFloor),
    lines_measured: EXPECTED[i]!.linesMeasured ?? '',
    line_flux_unit: EXPECTED[i]!.lineFluxUnit ?? '',
    z_caveat: EXPECTED[i]!.caveat ?? '',
    ra: r.ra === null ? '' : String(r.ra),
    file_name: r.fileName,
    lines: r.lines.join(';'),
    readers: r.readers.join(';'),
    supersedes: r.supersedes === null ? '' : String(r.supersedes),
    interloper_dchi2: r.interloperDeltaChi2 === null ? '' : String(r.interloperDeltaChi2),
  };
};

describe('ECSV export against Astropy APE 6 (ECSV 1.0)', () => {
  const text = toEcsv(ROWS, ASSUMPTIONS);
  const { header, body } = splitEcsv(text);

  it("starts with '# %ECSV 1.0' then '# ---' (APE 6; reference-values.md §7, C)", () => {
    expect(text.split('\n')[0]).toBe('# %ECSV 1.0');
    expect(header[1]).toBe('---');
  });

  it('has a YAML header with datatype entries, comma delimiter, schema astropy-2.0 and the assumptions under meta', () => {
    const yaml = parseYaml(header.slice(2).join('\n')) as {
      delimiter: string;
      schema: string;
      datatype: { name: string; datatype: string; unit?: string; description?: string }[];
      meta: Record<string, unknown>;
    };
    expect(yaml.delimiter).toBe(',');
    expect(yaml.schema).toBe('astropy-2.0');
    // APE 6 datatypes; the ones this export uses.
    for (const d of yaml.datatype) expect(['int64', 'float64', 'string', 'bool']).toContain(d.datatype);
    const byName = Object.fromEntries(yaml.datatype.map((d) => [d.name, d]));
    expect(byName.z).toMatchObject({ datatype: 'float64' });
    expect(byName.ra).toMatchObject({ datatype: 'float64', unit: 'deg' });
    expect(byName.record_id).toMatchObject({ datatype: 'int64' });
    expect(byName.target_id).toMatchObject({ datatype: 'string' });
    expect(byName.lookback_time).toMatchObject({ unit: 'Gyr' });
    expect(yaml.meta.campaign).toBe(ASSUMPTIONS.campaign);
    expect(yaml.meta.wavelengths).toBe('vacuum');
    expect(yaml.meta.cosmology).toMatchObject({ H0: 67.4, Om0: 0.315, Ode0: 0.685, flat: true });
    expect(yaml.meta.agreement_tolerance).toBe(0.002);
    expect(yaml.meta.grade_scheme).toEqual(ASSUMPTIONS.gradeScheme);
    expect(yaml.meta.exported_at).toBe(ASSUMPTIONS.exportedAt);
    // APE 6: readers check that the body's first line names the same columns as the header.
    const names = Papa.parse<string[]>(body.split('\n')[0]!).data[0];
    expect(names).toEqual(yaml.datatype.map((d) => d.name));
  });

  it('has a CSV body that papaparse reads back to the input values, nulls as empty fields', () => {
    const parsed = Papa.parse<Record_>(body, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.length).toBe(ROWS.length);
    parsed.data.forEach((rec, i) => expect(rec).toMatchObject(expectedCells(i)));
  });
});

describe('CSV export', () => {
  const text = toCsv(ROWS, ASSUMPTIONS);

  it('states every assumption, the grade scheme and each column in # key: value lines', () => {
    const comments = Object.fromEntries(
      text
        .split('\n')
        .filter((l) => l.startsWith('# ') && l.includes(': '))
        .map((l) => [l.slice(2, l.indexOf(': ')), l.slice(l.indexOf(': ') + 2)]),
    );
    expect(comments.wavelengths).toBe('vacuum');
    expect(comments.cosmology_h0).toBe('67.4');
    expect(comments.cosmology_omega_m).toBe('0.315');
    expect(comments.agreement_tolerance).toMatch(/^0\.002 /);
    expect(comments.exported_at).toBe(ASSUMPTIONS.exportedAt);
    expect(comments.software).toBe(ASSUMPTIONS.software);
    expect(comments['grade.sure']).toMatch(/^sure: At least 99 %/);
    expect(comments['grade.no-z']).toMatch(/^no redshift: /);
    expect(comments['column.ra']).toMatch(/\[deg\]$/);
    expect(comments['column.lookback_time']).toMatch(/\[Gyr\]$/);
  });

  it("round-trips through papaparse { comments: '#', header: true }, including a target id that starts with '#'", () => {
    const parsed = Papa.parse<Record_>(text, { comments: '#', header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.length).toBe(ROWS.length);
    parsed.data.forEach((rec, i) => expect(rec).toMatchObject(expectedCells(i)));
    expect(parsed.data[2]!.target_id).toBe('#7 & <b>');
  });
});

describe('Derived columns under the stated cosmology', () => {
  const planck = ASSUMPTIONS.cosmology;

  it('lookback time at z = 6.2 is 12.905 Gyr for H0 = 67.4, Ω_m = 0.315 (reference-values.md §4: closed form, D)', () => {
    expect(Math.abs(cosmicColumns(6.2, planck).lookbackGyr - 12.905)).toBeLessThan(0.001);
  });

  it('luminosity distance at z = 1 and 3 is 6802.53 and 26024.25 Mpc (reference-values.md §4 table, D; scipy quad)', () => {
    expect(cosmicColumns(1, planck).luminosityMpc).toBeCloseTo(6802.53, 1);
    expect(cosmicColumns(3, planck).luminosityMpc).toBeCloseTo(26024.25, 1);
  });

  it('for z ≤ 0 (stars) gives lookback 0 and no distance, as the metadata states', () => {
    expect(cosmicColumns(-0.0002, planck)).toEqual({ lookbackGyr: 0, luminosityMpc: null });
    expect(cosmicColumns(0, planck)).toEqual({ lookbackGyr: 0, luminosityMpc: null });
    const parsed = Papa.parse<Record_>(toCsv(ROWS, ASSUMPTIONS), { comments: '#', header: true, skipEmptyLines: true });
    expect(parsed.data[1]).toMatchObject({ lookback_time: '0', luminosity_distance: '' });
  });

  it('follows the cosmology it states: H0 = 70, Ω_m = 0.3 gives 12.5879 Gyr at z = 6.2 (reference-values.md §4 table, D)', () => {
    const c70 = { name: 'flat 70/0.3', h0: 70, omegaM: 0.3, omegaLambda: 0.7, flat: true as const };
    expect(cosmicColumns(6.2, c70).lookbackGyr).toBeCloseTo(12.5879, 3);
  });
});
