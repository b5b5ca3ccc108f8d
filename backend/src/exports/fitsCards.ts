import { fitsAscii } from './fitsAscii';

/** Keyword values a header card can carry; bigint for 64-bit integers such as TNULLn of a K column. */
export type CardValue = string | number | bigint | boolean;

const CARD = 80;

function checkKeyword(key: string): void {
  // FITS 4.0 §4.1.2.1: up to 8 characters from A–Z, 0–9, '-' and '_'.
  if (!/^[A-Z0-9_-]{1,8}$/.test(key)) throw new RangeError(`'${key}' is not a FITS keyword (1–8 of A–Z, 0–9, '-', '_').`);
}

/** A real in FITS form: always with a '.' and an upper-case exponent, so no reader takes it for an integer. */
export function fitsReal(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`A FITS header real must be finite, got ${x}.`);
  const [mantissa, exponent] = String(x).toUpperCase().split('E') as [string, string | undefined];
  const m = mantissa.includes('.') ? mantissa : mantissa + '.0';
  return exponent === undefined ? m : `${m}E${exponent}`;
}

const quote = (s: string) => `'${s.replaceAll("'", "''")}'`;

function withComment(text: string, comment: string | undefined): string {
  if (!comment) return text.padEnd(CARD);
  const room = CARD - text.length - 3;
  return room > 0 ? `${text} / ${fitsAscii(comment).slice(0, room)}`.padEnd(CARD) : text.padEnd(CARD);
}

/**
 * Splits a string value into pieces of at most `room` characters once quotes are doubled, never
 * between the two quotes of a pair.
 */
function splitString(s: string, room: number): string[] {
  const pieces: string[] = [];
  let piece = '';
  let used = 0;
  for (const ch of s) {
    const cost = ch === "'" ? 2 : 1;
    if (used + cost > room) {
      pieces.push(piece);
      piece = '';
      used = 0;
    }
    piece += ch;
    used += cost;
  }
  pieces.push(piece);
  return pieces;
}

/**
 * Header cards for one keyword (FITS 4.0 §4.2): logicals, integers and reals right-justified to
 * column 30 (the fixed format that mandatory keywords require), strings quoted from column 11,
 * padded to 8 characters, with quotes doubled. A string too long for one card continues over
 * CONTINUE cards, each piece but the last ending in '&' (FITS 4.0 §4.2.1.2).
 */
export function valueCards(key: string, value: CardValue, comment?: string): string[] {
  checkKeyword(key);
  const head = `${key.padEnd(8)}= `;
  if (typeof value !== 'string') {
    const v =
      typeof value === 'boolean' ? (value ? 'T' : 'F') : typeof value === 'bigint' ? value.toString() : Number.isInteger(value) ? String(value) : fitsReal(value);
    return [withComment(head + v.padStart(20), comment)];
  }
  const s = fitsAscii(value);
  // 68 = 80 − "KEYWORD = " − two quotes; one more is kept for the '&' of a continued piece.
  if (quote(s).length <= 70) return [withComment(head + quote(s.padEnd(8)), comment)];
  const pieces = splitString(s, 67);
  return pieces.map((p, i) => {
    const last = i === pieces.length - 1;
    const text = (i === 0 ? head : 'CONTINUE  ') + quote(last ? p : p + '&');
    return last ? withComment(text, comment) : text.padEnd(CARD);
  });
}

/** COMMENT or HISTORY cards: free ASCII text in columns 9–80, wrapped at spaces (FITS 4.0 §4.4.2.4). */
export function commentaryCards(key: 'COMMENT' | 'HISTORY', text: string): string[] {
  const words = fitsAscii(text).split(' ');
  const lines: string[] = [];
  let line = '';
  for (const w of words) {
    for (let rest = w; ; ) {
      const candidate = line ? `${line} ${rest}` : rest;
      if (candidate.length <= 72) {
        line = candidate;
        break;
      }
      if (line) {
        lines.push(line);
        line = '';
      } else {
        lines.push(rest.slice(0, 72));
        rest = rest.slice(72);
      }
    }
  }
  if (line || lines.length === 0) lines.push(line);
  return lines.map((l) => `${key.padEnd(8)}${l}`.padEnd(CARD));
}

/** A header: the cards, END, and spaces up to a whole number of 2880-byte blocks (FITS 4.0 §3.3.1, §4.4.1). */
export function headerBytes(cards: readonly string[]): Uint8Array {
  const text = [...cards, 'END'.padEnd(CARD)].join('');
  const out = new Uint8Array(Math.ceil(text.length / 2880) * 2880).fill(0x20);
  for (let i = 0; i < text.length; i++) out[i] = text.charCodeAt(i);
  return out;
}
