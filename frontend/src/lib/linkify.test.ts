import { describe, expect, it } from 'vitest';
import { splitLinks } from './linkify';

describe('splitLinks', () => {
  it('finds an invitation address on its own line, as in the invitation e-mail', () => {
    const text = 'Open this link to accept:\nhttp://localhost:3000/invitations/Ab_-9\n\nThe link works once.';
    expect(splitLinks(text)).toEqual([
      { kind: 'text', text: 'Open this link to accept:\n' },
      { kind: 'url', text: 'http://localhost:3000/invitations/Ab_-9' },
      { kind: 'text', text: '\n\nThe link works once.' },
    ]);
  });

  it('leaves sentence punctuation outside the link', () => {
    expect(splitLinks('See https://example.org/a.')).toEqual([
      { kind: 'text', text: 'See ' },
      { kind: 'url', text: 'https://example.org/a' },
      { kind: 'text', text: '.' },
    ]);
  });

  it('treats markup as plain text and links only http(s) addresses', () => {
    expect(splitLinks('<a href="javascript:alert(1)">x</a>')).toEqual([
      { kind: 'text', text: '<a href="javascript:alert(1)">x</a>' },
    ]);
  });

  it('returns nothing for empty text', () => {
    expect(splitLinks('')).toEqual([]);
  });
});
