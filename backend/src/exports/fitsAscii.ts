/**
 * The rule for text in FITS exports, whose headers and character columns hold printable ASCII
 * (U+0020–U+007E) only (FITS 4.0 §4.1.1 and §7.3.3.1): letters lose their accents (Unicode NFKD,
 * combining marks dropped, so "Zoë" → "Zoe"), tabs and line breaks become spaces, and any other
 * character becomes '?'.
 */
export function fitsAscii(s: string): string {
  return s
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[\t\n\r\u000b\u000c\u0085\u2028\u2029]/g, ' ')
    .replace(/[^\x20-\x7e]/gu, '?');
}
