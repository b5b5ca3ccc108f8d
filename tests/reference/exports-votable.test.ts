import { XMLParser } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { CONFIRMED_COLUMNS } from '../../backend/src/exports/confirmedColumns';
import { toVotable } from '../../backend/src/exports/toVotable';
import { ASSUMPTIONS, EXPECTED, ROWS } from '../unit/exports/sample';

const parser = new XMLParser({
  ignoreAttributes: false,
  attributeNamePrefix: '',
  trimValues: false,
  parseTagValue: false,
  parseAttributeValue: false,
  htmlEntities: true,
  isArray: (name) => ['TR', 'TD', 'FIELD', 'INFO', 'OPTION'].includes(name),
});

// Words of the IVOA UCD list used by the export, with their syntax flags, copied from
// ivoa-std/UCDList ucd-list.txt (PEN-UCDlist-v1.5-2022-07-15, read). Flag P: primary only (first
// word); S: secondary only; Q: either; V: vector, either.
const UCD_WORDS: Record<string, string> = {
  'meta.id': 'P', 'meta.main': 'S', 'meta.file': 'S', 'meta.record': 'P', 'meta.id.parent': 'P',
  'meta.code.qual': 'P', 'meta.code.status': 'P', 'pos.eq.ra': 'Q', 'pos.eq.dec': 'Q',
  'src.redshift': 'Q', 'src.redshift.phot': 'Q', 'stat.error': 'P', 'stat.min': 'S', 'stat.max': 'S',
  'src.class': 'Q', 'spect.line': 'S', 'time.creation': 'Q', 'time.interval': 'Q', 'pos.distance': 'V',
  'phys.cosmology': 'S', 'stat.fit.chi2': 'P', 'stat.fit.param': 'Q', 'stat.probability': 'Q',
  // Same file, commit 0940a341 (read): meta.note "Note or remark", meta.unit "Unit", both P.
  'meta.note': 'P', 'meta.unit': 'P',
};

type Node = Record<string, unknown>;
function parse(xml: string) {
  const doc = parser.parse(xml) as Node;
  const votable = doc.VOTABLE as Node;
  const resource = votable.RESOURCE as Node;
  const table = resource.TABLE as Node;
  const fields = table.FIELD as Node[];
  const trs = ((table.DATA as Node).TABLEDATA as Node).TR as Node[];
  // An empty <TD/> parses as ''; that is the TABLEDATA null.
  const cells = trs.map((tr) => (tr.TD as unknown[]).map((td) => (typeof td === 'string' ? td : '')));
  return { votable, resource, fields, cells };
}

describe('VOTable export against IVOA VOTable REC 1.4/1.5 and the UCD list', () => {
  const xml = toVotable(ROWS, ASSUMPTIONS);
  const { votable, resource, fields, cells } = parse(xml);

  it('is an XML document whose root carries version 1.4 and the v1.3 namespace (VOTable REC 1.4 §3; namespace fixed since 1.3, reference-values.md §7, C)', () => {
    expect(xml.startsWith('<?xml version="1.0" encoding="UTF-8"?>')).toBe(true);
    expect(votable.version).toBe('1.4');
    expect(votable.xmlns).toBe('http://www.ivoa.net/xml/VOTable/v1.3');
  });

  it('declares every column as a FIELD with a VOTable primitive datatype and arraysize="*" for text (REC 1.4 §2.1, from memory)', () => {
    expect(fields.map((f) => f.name)).toEqual(CONFIRMED_COLUMNS.map((c) => c.name));
    for (const f of fields) {
      expect(['int', 'long', 'double', 'char', 'unicodeChar']).toContain(f.datatype);
      if (f.datatype === 'char' || f.datatype === 'unicodeChar') expect(f.arraysize).toBe('*');
    }
    const byName = Object.fromEntries(fields.map((f) => [f.name as string, f]));
    expect(byName.z).toMatchObject({ datatype: 'double', ucd: 'src.redshift' });
    expect(byName.z_err).toMatchObject({ ucd: 'stat.error;src.redshift' });
    expect(byName.ra).toMatchObject({ unit: 'deg', ucd: 'pos.eq.ra;meta.main' });
    expect(byName.dec).toMatchObject({ unit: 'deg', ucd: 'pos.eq.dec;meta.main' });
    expect(byName.photo_z).toMatchObject({ ucd: 'src.redshift.phot' });
    expect(byName.grade_code).toMatchObject({ datatype: 'char', ucd: 'meta.code.qual' });
    expect(byName.lookback_time).toMatchObject({ unit: 'Gyr' });
    expect(byName.luminosity_distance).toMatchObject({ unit: 'Mpc' });
    // 'Zoë Ångström' is not ASCII, which VOTable 1.4 char cannot hold.
    expect(byName.readers!.datatype).toBe('unicodeChar');
    expect(byName.file_name!.datatype).toBe('char');
  });

  it('uses only UCD words of ucd-list.txt v1.5, primary-only words first and secondary-only words after', () => {
    for (const f of fields) {
      const words = (f.ucd as string).split(';');
      words.forEach((w, i) => {
        expect(UCD_WORDS[w], `${f.name}: ${w}`).toBeDefined();
        if (i === 0) expect(UCD_WORDS[w], `${f.name}: ${w} leads`).not.toBe('S');
        else expect(UCD_WORDS[w], `${f.name}: ${w} follows`).not.toBe('P');
      });
    }
  });

  it('carries the assumptions as INFO elements and the grade scheme as VALUES/OPTION', () => {
    const infos = Object.fromEntries((resource.INFO as Node[]).map((i) => [i.name as string, i.value as string]));
    expect(infos.campaign).toBe(ASSUMPTIONS.campaign);
    expect(infos.wavelengths).toBe('vacuum');
    expect(infos.cosmology_h0).toBe('67.4');
    expect(infos.cosmology_omega_m).toBe('0.315');
    expect(infos.exported_at).toBe(ASSUMPTIONS.exportedAt);
    expect(infos.software).toBe(ASSUMPTIONS.software);
    expect(infos['grade.sure']).toMatch(/^sure: At least 99 % sure/);
    const grade = fields.find((f) => f.name === 'grade_code')!;
    const options = (grade.VALUES as Node).OPTION as Node[];
    expect(options.map((o) => [o.value, o.name])).toEqual(ASSUMPTIONS.gradeScheme.map((g) => [String(g.code), g.label]));
  });

  it('has rows × fields TD cells, empty TD for nulls, and escaped special characters read back intact', () => {
    expect(cells.length).toBe(ROWS.length);
    expect(cells.flat().length).toBe(ROWS.length * fields.length);
    const col = (name: string) => fields.findIndex((f) => f.name === name);
    expect(cells[1]![col('target_id')]).toBe('');
    expect(cells[1]![col('ra')]).toBe('');
    expect(cells[1]![col('file_name')]).toBe('star, "cool" <M9>.txt');
    expect(cells[2]![col('target_id')]).toBe('#7 & <b>');
    expect(cells[1]![col('readers')]).toBe('Zoë Ångström');
    expect(Number(cells[0]![col('z')])).toBe(6.2);
    expect(xml).toContain('&lt;M9&gt;');
  });
});
