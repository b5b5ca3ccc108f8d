import fc from 'fast-check';
import Papa from 'papaparse';
import { XMLParser } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { fitsAscii } from '../../../backend/src/exports/fitsAscii';
import { toCsv } from '../../../backend/src/exports/toCsv';
import { toEcsv } from '../../../backend/src/exports/toEcsv';
import { toFitsTable } from '../../../backend/src/exports/toFitsTable';
import { toVotable } from '../../../backend/src/exports/toVotable';
import { ASSUMPTIONS, row } from './sample';

// Text with the characters that break naive writers: quotes, commas, line breaks, '#', XML
// specials, outer spaces, accents, CJK and astral characters.
const nasty = fc.string({
  unit: fc.oneof(
    fc.constantFrom('"', "'", ',', ';', '\n', '\r', '\t', '#', '&', '<', '>', ' ', 'é', 'Å', '中', '😀', '\u2028'),
    fc.string({ unit: 'grapheme', minLength: 1, maxLength: 1 }),
  ),
  minLength: 1,
  maxLength: 20,
});

const makeRows = (a: string, b: string, c: string) => [row({ targetId: a, fileName: b, imageFamily: c })];

const csvBack = (text: string) => Papa.parse<Record<string, string>>(text, { comments: '#', header: true, skipEmptyLines: true });

/** XML 1.0 Char (W3C XML 1.0 §2.2, from memory); anything else is the stated U+FFFD replacement. */
const xmlExpected = (s: string) => s.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD');

const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', trimValues: false, parseTagValue: false, htmlEntities: true, isArray: (n) => ['TR', 'TD', 'FIELD'].includes(n) });

describe('any text survives the text formats', () => {
  it('CSV', () => {
    fc.assert(
      fc.property(nasty, nasty, nasty, (a, b, c) => {
        const parsed = csvBack(toCsv(makeRows(a, b, c), { ...ASSUMPTIONS, campaign: a }));
        expect(parsed.errors).toEqual([]);
        expect(parsed.data[0]).toMatchObject({ target_id: a, file_name: b, image_family: c });
      }),
      { numRuns: 200 },
    );
  });

  it('ECSV body', () => {
    fc.assert(
      fc.property(nasty, nasty, nasty, (a, b, c) => {
        const text = toEcsv(makeRows(a, b, c), { ...ASSUMPTIONS, campaign: c });
        const lines = text.split('\n');
        const body = lines.slice(lines.findIndex((l) => !l.startsWith('#'))).join('\n');
        const parsed = Papa.parse<Record<string, string>>(body, { header: true, skipEmptyLines: true });
        expect(parsed.errors).toEqual([]);
        expect(parsed.data[0]).toMatchObject({ target_id: a, file_name: b, image_family: c });
      }),
      { numRuns: 200 },
    );
  });

  it('VOTable, with characters XML cannot carry replaced by U+FFFD', () => {
    fc.assert(
      fc.property(fc.tuple(nasty, fc.string({ unit: 'binary', minLength: 1, maxLength: 4 })), nasty, ([a, control], b) => {
        const xml = toVotable(makeRows(a + control, b, 'f'), { ...ASSUMPTIONS, campaign: b });
        const doc = parser.parse(xml) as { VOTABLE: { RESOURCE: { TABLE: { FIELD: { name: string }[]; DATA: { TABLEDATA: { TR: { TD: unknown[] }[] } } } } } };
        const table = doc.VOTABLE.RESOURCE.TABLE;
        const tds = table.DATA.TABLEDATA.TR[0]!.TD;
        const at = (name: string) => tds[table.FIELD.findIndex((f) => f.name === name)];
        expect(at('target_id')).toBe(xmlExpected(a + control));
        expect(at('file_name')).toBe(b);
      }),
      { numRuns: 150 },
    );
  });
});

describe('FITS text follows the stated ASCII rule', () => {
  it('every text byte is printable ASCII and equals fitsAscii of the input', () => {
    fc.assert(
      fc.property(nasty, (a) => {
        const bytes = toFitsTable(makeRows(a, 'x.fits', 'f'), { ...ASSUMPTIONS, campaign: a });
        const text = String.fromCharCode(...bytes.subarray(0, 2880 * 2));
        expect(text).toMatch(/^[\x20-\x7e]*$/);
        const expected = fitsAscii(a);
        expect(expected).toMatch(/^[\x20-\x7e]*$/);
        const haystack = String.fromCharCode(...bytes);
        expect(haystack).toContain(expected.trimEnd());
      }),
      { numRuns: 100 },
    );
  });

  it('the VOTable check does meet characters XML cannot carry', () => {
    expect(xmlExpected('a\u0001\uD800b')).toBe('a\uFFFD\uFFFDb');
  });

  it('drops accents and replaces what has no ASCII form', () => {
    expect(fitsAscii('Zoë Ångström')).toBe('Zoe Angstrom');
    expect(fitsAscii('a\tb\nc')).toBe('a b c');
    expect(fitsAscii('中😀')).toBe('??');
  });
});
