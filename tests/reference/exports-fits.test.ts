import { describe, expect, it } from 'vitest';
import { toFitsTable } from '../../backend/src/exports/toFitsTable';
import { listHdus } from '../../backend/src/spectra/fits/listHdus';
import { readBinaryTable } from '../../backend/src/spectra/fits/readBinaryTable';
import { ASSUMPTIONS, EXPECTED, ROWS, row } from '../unit/exports/sample';

// A reader written here, independently of the writer, to the FITS 4.0 rules ("Definition of the
// Flexible Image Transport System, Version 4.0", IAU FITS WG; rules quoted from memory unless the
// line says otherwise): §3.1 2880-byte blocks; §4.1 80-character cards of ASCII 0x20–0x7E;
// §4.4.1 mandatory keywords in order; §7.3 binary tables, big-endian, NAXIS1 = row width.

const BLOCK = 2880;
/** Bytes per element for TFORM codes (reference-values.md §7: letters C, sizes M). */
const SIZES: Record<string, number> = { L: 1, B: 1, I: 2, J: 4, K: 8, A: 1, E: 4, D: 8, C: 8, M: 16, P: 8, Q: 16 };

interface Card { key: string; raw: string }
interface Header { cards: Card[]; end: number; values: Map<string, string> }

function readHeader(bytes: Uint8Array, start: number): Header {
  const cards: Card[] = [];
  for (let at = start; at + 80 <= bytes.length; at += 80) {
    const slice = bytes.subarray(at, at + 80);
    for (const b of slice) if (b < 0x20 || b > 0x7e) throw new Error(`byte ${b} at card ${cards.length} is not printable ASCII`);
    const raw = String.fromCharCode(...slice);
    const key = raw.slice(0, 8).trimEnd();
    if (key === 'END') {
      expect(raw.slice(3).trim()).toBe('');
      const end = Math.ceil((at + 80) / BLOCK) * BLOCK;
      // Header padding after END is spaces (§4.4.1).
      for (let p = at + 80; p < end; p++) expect(bytes[p]).toBe(0x20);
      return { cards, end, values: valuesOf(cards) };
    }
    cards.push({ key, raw });
  }
  throw new Error('no END card');
}

/** Values of the keyword cards, with quotes undone and CONTINUE pieces joined (§4.2.1.2). */
function valuesOf(cards: Card[]): Map<string, string> {
  const values = new Map<string, string>();
  let last = '';
  for (const c of cards) {
    if (c.key === 'CONTINUE' && values.get(last)?.endsWith('&')) {
      values.set(last, values.get(last)!.slice(0, -1) + stringValue(c.raw.slice(10)));
    } else if (c.raw.slice(8, 10) === '= ') {
      const v = c.raw.slice(10).trimStart();
      values.set(c.key, v.startsWith("'") ? stringValue(v) : v.split('/')[0]!.trim());
      last = c.key;
    }
  }
  return values;
}

function stringValue(field: string): string {
  const m = /^\s*'((?:[^']|'')*)'/.exec(field);
  if (!m) throw new Error(`not a string value: ${field}`);
  return m[1]!.replaceAll("''", "'").trimEnd();
}

function columnWidth(tform: string): number {
  const m = /^(\d*)([LBIJKAEDCMPQ])$/.exec(tform.trim());
  if (!m) throw new Error(`TFORM ${tform}`);
  return (m[1] === '' ? 1 : Number(m[1])) * SIZES[m[2]!]!;
}

describe('FITS binary-table export against the FITS 4.0 rules', () => {
  const bytes = toFitsTable(ROWS, ASSUMPTIONS);
  const primary = readHeader(bytes, 0);
  const ext = readHeader(bytes, primary.end);
  const v = (k: string) => ext.values.get(k);

  it('is a whole number of 2880-byte blocks of 80-character ASCII cards, each header ending in END', () => {
    expect(bytes.length % BLOCK).toBe(0);
    expect(primary.end % BLOCK).toBe(0);
    expect(ext.end % BLOCK).toBe(0);
  });

  it('starts with an empty primary HDU: SIMPLE, BITPIX, NAXIS in order, NAXIS = 0, EXTEND = T, values in fixed format (col 30)', () => {
    expect(primary.cards.slice(0, 4).map((c) => c.key)).toEqual(['SIMPLE', 'BITPIX', 'NAXIS', 'EXTEND']);
    expect(primary.cards[0]!.raw.slice(0, 30)).toBe('SIMPLE  =                    T');
    expect(primary.cards[1]!.raw.slice(0, 30)).toBe('BITPIX  =                    8');
    expect(primary.cards[2]!.raw.slice(0, 30)).toBe('NAXIS   =                    0');
    expect(primary.values.get('EXTEND')).toBe('T');
  });

  it('has the BINTABLE mandatory keywords in the required order (§7.3.1) and NAXIS1 = sum of the TFORM widths', () => {
    expect(ext.cards.slice(0, 8).map((c) => c.key)).toEqual(['XTENSION', 'BITPIX', 'NAXIS', 'NAXIS1', 'NAXIS2', 'PCOUNT', 'GCOUNT', 'TFIELDS']);
    expect(ext.cards[0]!.raw.slice(0, 20)).toBe("XTENSION= 'BINTABLE'");
    expect([v('BITPIX'), v('NAXIS'), v('PCOUNT'), v('GCOUNT')]).toEqual(['8', '2', '0', '1']);
    // Integer values end in column 30 (fixed format).
    for (const c of ext.cards.slice(1, 8)) expect(c.raw[29]).toMatch(/\d/);
    const fields = Number(v('TFIELDS'));
    const widths = Array.from({ length: fields }, (_, i) => columnWidth(v(`TFORM${i + 1}`)!));
    expect(Number(v('NAXIS1'))).toBe(widths.reduce((a, b) => a + b, 0));
    expect(Number(v('NAXIS2'))).toBe(ROWS.length);
    const dataBytes = Number(v('NAXIS1')) * Number(v('NAXIS2'));
    expect(bytes.length).toBe(ext.end + Math.ceil(dataBytes / BLOCK) * BLOCK);
    // Data padding is zeros (§3.3.2).
    for (let p = ext.end + dataBytes; p < bytes.length; p++) expect(bytes[p]).toBe(0);
    // Keywords are at most 8 characters: every card's key is within columns 1–8 and followed by '= ' or commentary.
    for (const c of ext.cards) expect(c.key).toMatch(/^[A-Z0-9_-]{1,8}$/);
  });

  it('carries the assumptions as header keywords', () => {
    expect(v('WAVEMED')).toBe('VACUUM');
    expect(Number(v('COSMO_H0'))).toBe(67.4);
    expect(Number(v('COSMO_OM'))).toBe(0.315);
    expect(Number(v('COSMO_OL'))).toBe(0.685);
    expect(Number(v('ZTOLER'))).toBe(0.002);
    expect(v('CAMPAIGN')).toBe(ASSUMPTIONS.campaign);
    expect(v('SOFTWARE')).toBe(ASSUMPTIONS.software);
    expect(v('DATE')).toBe('2025-03-14T09:26:53.000');
    const comments = ext.cards.filter((c) => c.key === 'COMMENT').map((c) => c.raw.slice(8).trim()).join(' ');
    expect(comments).toContain('Grade sure = sure: At least 99 %');
  });

  it('reads back big-endian: D as float64 (NaN for null), K with TNULL for null, A trimmed (NUL-first for null)', () => {
    const fields = Number(v('TFIELDS'));
    const rowWidth = Number(v('NAXIS1'));
    const view = new DataView(bytes.buffer, bytes.byteOffset + ext.end);
    const cols: Record<string, { form: string; offset: number; tnull?: string }> = {};
    let offset = 0;
    for (let i = 1; i <= fields; i++) {
      const form = v(`TFORM${i}`)!;
      cols[v(`TTYPE${i}`)!] = { form, offset, tnull: v(`TNULL${i}`) };
      offset += columnWidth(form);
    }
    const cell = (r: number, name: string): number | bigint | string | null => {
      const c = cols[name]!;
      const at = r * rowWidth + c.offset;
      if (c.form === 'D') {
        const x = view.getFloat64(at);
        return Number.isNaN(x) ? null : x;
      }
      if (c.form === 'K') {
        const x = view.getBigInt64(at);
        return String(x) === c.tnull ? null : x;
      }
      if (c.form === 'J') return view.getInt32(at);
      const width = columnWidth(c.form);
      const raw = bytes.subarray(ext.end + at, ext.end + at + width);
      return raw[0] === 0 ? null : String.fromCharCode(...raw).trimEnd();
    };
    ROWS.forEach((input, r) => {
      expect(cell(r, 'z')).toBe(EXPECTED[r]!.z);
      expect(cell(r, 'z_err')).toBe(EXPECTED[r]!.zErr);
      expect(cell(r, 'z_err_floor')).toBe(input.zErrFloor);
      // FITS text is ASCII: "4000 Å break" is written "4000 A break" (the stated NFKD rule).
      expect(cell(r, 'lines_measured')).toBe(EXPECTED[r]!.linesMeasured?.replace('Å', 'A') ?? null);
      expect(cell(r, 'line_flux_unit')).toBe(EXPECTED[r]!.lineFluxUnit);
      expect(cell(r, 'z_caveat')).toBe(EXPECTED[r]!.caveat);
      expect(cell(r, 'ra')).toBe(input.ra);
      expect(cell(r, 'record_id')).toBe(BigInt(input.id));
      expect(cell(r, 'supersedes')).toBe(input.supersedes === null ? null : BigInt(input.supersedes));
      expect(cell(r, 'grade_code')).toBe(input.gradeCode);
      expect(cell(r, 'target_id')).toBe(input.targetId);
      expect(cell(r, 'lines')).toBe(input.lines.length ? input.lines.join(';').replace('Å', 'A') : null);
    });
    expect(cell(1, 'file_name')).toBe('star, "cool" <M9>.txt');
    // The stated ASCII rule: accents dropped by NFKD.
    expect(cell(1, 'readers')).toBe('Zoe Angstrom');
    // Lookback time at z = 6.2 for H0 = 67.4, Ω_m = 0.315: 12.905 Gyr (reference-values.md §4, D).
    expect(cell(0, 'lookback_time') as number).toBeCloseTo(12.905, 3);
    expect(cell(1, 'luminosity_distance')).toBeNull();
  });

  it("is read by the engine's own FITS reader (listHdus, readBinaryTable) with the same numbers", () => {
    const hdus = listHdus(bytes);
    expect(hdus.map((h) => h.kind)).toEqual(['image', 'bintable']);
    const cols = readBinaryTable(bytes, hdus[1]!);
    const z = cols.find((c) => c.name === 'z')!;
    expect(Array.from(z.values)).toEqual(EXPECTED.map((r) => r.z));
    const dl = cols.find((c) => c.name === 'luminosity_distance')!;
    // D_L(z = 1) = 6802.53 Mpc for 67.4 / 0.315 (reference-values.md §4 table, D).
    expect(dl.values[2]).toBeCloseTo(6802.53, 1);
  });

  it('continues a string longer than one card over CONTINUE cards and doubles quotes (§4.2.1.2)', () => {
    const campaign = `Frontier Fields follow-up of Abell 2744's arcs, MACS J0416's arcs and the parallel fields, year 3`;
    const long = toFitsTable([row()], { ...ASSUMPTIONS, campaign });
    const p = readHeader(long, 0);
    const h = readHeader(long, p.end);
    expect(h.cards.some((c) => c.key === 'CONTINUE')).toBe(true);
    expect(h.values.get('CAMPAIGN')).toBe(campaign);
  });

  it('writes a valid file with no rows: NAXIS2 = 0, text columns 1 byte wide, no data block', () => {
    const empty = toFitsTable([], ASSUMPTIONS);
    const p = readHeader(empty, 0);
    const h = readHeader(empty, p.end);
    expect(h.values.get('NAXIS2')).toBe('0');
    expect(h.values.get('TFORM2')).toBe('1A');
    expect(empty.length).toBe(h.end);
  });
});
