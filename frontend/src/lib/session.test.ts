import { describe, expect, it } from 'vitest';
import { safeNextPath, signInPath } from './session';

describe('safeNextPath', () => {
  it('keeps a same-site path with its query', () => {
    expect(safeNextPath('/invitations/abc?x=1')).toBe('/invitations/abc?x=1');
  });

  it.each(['https://evil.example/', '//evil.example/', '/\\evil.example', 'campaigns', '', null, undefined])(
    'refuses %s and falls back to the campaigns list',
    (next) => {
      expect(safeNextPath(next)).toBe('/campaigns');
    },
  );
});

describe('signInPath', () => {
  it('carries the page to return to', () => {
    expect(signInPath('/invitations/t0k')).toBe('/sign-in?next=%2Finvitations%2Ft0k');
  });

  it('omits a return to the root, which only redirects to the campaigns', () => {
    expect(signInPath('/')).toBe('/sign-in');
  });
});
