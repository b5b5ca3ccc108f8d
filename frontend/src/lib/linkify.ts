/** A piece of plain text, or a web address found in it. */
export type TextPart = { kind: 'text'; text: string } | { kind: 'url'; text: string };

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
// Sentence punctuation right after a link belongs to the sentence, not to the address.
const TRAILING = /[.,;:!?)\]}]+$/;

/** Splits e-mail text so addresses can be rendered as links without ever interpreting HTML. */
export function splitLinks(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index;
    const url = match[0].replace(TRAILING, '');
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'url', text: url });
    last = start + url.length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}
