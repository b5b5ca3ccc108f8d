/**
 * Characters XML 1.0 cannot carry at all, not even as references (W3C XML 1.0 §2.2, production
 * Char): C0 controls other than tab, LF and CR; U+FFFE, U+FFFF; unpaired surrogates.
 */
const NOT_XML_CHAR = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

const ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&apos;',
  // Parsers normalise raw CR, LF and tab (line-end handling, attribute-value normalisation);
  // character references are kept as written.
  '\r': '&#13;',
  '\n': '&#10;',
  '\t': '&#9;',
};

/**
 * Text safe for XML element content and attribute values alike. Characters XML cannot carry are
 * replaced by U+FFFD (the stated rule for VOTable exports); everything else survives parsing.
 */
export function xmlText(s: string): string {
  return s.replace(NOT_XML_CHAR, '\uFFFD').replace(/[&<>"'\r\n\t]/g, (ch) => ESCAPES[ch]!);
}
