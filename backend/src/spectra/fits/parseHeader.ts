import { SpectrumReadError } from '../errors';

export type FitsValue = string | number | boolean;

/** One parsed header: keyword → value (first occurrence wins, as FITS readers commonly do). */
export interface FitsHeader {
  values: Map<string, FitsValue>;
  /** Bytes taken by the header, a multiple of 2880. */
  byteLength: number;
}

const BLOCK = 2880;
const CARD = 80;
/** No spectrum header needs more than this; a missing END must not make us scan a huge file. */
const MAX_HEADER_BLOCKS = 2000;

function parseValue(raw: string): FitsValue | undefined {
  const text = raw.trimStart();
  if (text.startsWith("'")) {
    let out = '';
    for (let i = 1; i < text.length; i++) {
      const ch = text[i]!;
      if (ch === "'") {
        if (text[i + 1] === "'") {
          out += "'";
          i++;
          continue;
        }
        return out.trimEnd();
      }
      out += ch;
    }
    return out.trimEnd();
  }
  const token = (text.split('/')[0] ?? '').trim();
  if (token === 'T') return true;
  if (token === 'F') return false;
  if (token === '') return undefined;
  const num = Number(token.replace(/[dD]/, 'E'));
  return Number.isFinite(num) ? num : token;
}

/**
 * Parses the header that starts at `offset` (FITS 4.0 §4: 2880-byte blocks of 80-character ASCII
 * cards ending with END). Throws a SpectrumReadError naming the HDU and card when it is malformed.
 */
export function parseHeader(bytes: Uint8Array, offset: number, hduIndex: number): FitsHeader {
  const values = new Map<string, FitsValue>();
  let pos = offset;
  for (let block = 0; block < MAX_HEADER_BLOCKS; block++) {
    if (pos + BLOCK > bytes.length) {
      throw new SpectrumReadError(
        'fits-header',
        `HDU ${hduIndex}: the header is cut off after ${block * 36} cards (no END card before the end of the file).`,
      );
    }
    for (let c = 0; c < 36; c++) {
      const start = pos + c * CARD;
      let card = '';
      for (let k = 0; k < CARD; k++) {
        const b = bytes[start + k]!;
        if (b < 0x20 || b > 0x7e) {
          throw new SpectrumReadError(
            'fits-header',
            `HDU ${hduIndex}: header card ${block * 36 + c + 1} contains a non-ASCII byte (0x${b.toString(16)}).`,
          );
        }
        card += String.fromCharCode(b);
      }
      const key = card.slice(0, 8).trimEnd();
      if (key === 'END') return { values, byteLength: pos + BLOCK - offset };
      if (card.slice(8, 10) !== '= ' || key === '' || values.has(key)) continue;
      const value = parseValue(card.slice(10));
      if (value !== undefined) values.set(key, value);
    }
    pos += BLOCK;
  }
  throw new SpectrumReadError('fits-header', `HDU ${hduIndex}: no END card within ${MAX_HEADER_BLOCKS} header blocks.`);
}

/** Reads a numeric keyword, or undefined when absent or not a number. */
export function num(header: FitsHeader, key: string): number | undefined {
  const v = header.values.get(key);
  return typeof v === 'number' && Number.isFinite(v) ? v : undefined;
}

/** Reads a string keyword, or undefined. */
export function str(header: FitsHeader, key: string): string | undefined {
  const v = header.values.get(key);
  return typeof v === 'string' ? v : undefined;
}
