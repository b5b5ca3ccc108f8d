import { sealData, unsealData } from 'iron-session';
import { describe, expect, it } from 'vitest';
import { cookieValue } from '../../../backend/src/http/session';
import { sealExpiresAt, UnsealedCookieCache } from '../../../backend/src/http/unsealed-cookie-cache';

const password = 'a-session-password-of-at-least-32-characters';

describe('UnsealedCookieCache', () => {
  it('gives back a copy of what was stored, so a session object changed later does not change the cache', () => {
    const cache = new UnsealedCookieCache<{ sessionId?: string }>();
    const data = { sessionId: 'abc' };
    cache.set('Fe26.2*1*s*iv*data**hs*h~2', data);
    data.sessionId = 'changed';
    const got = cache.get('Fe26.2*1*s*iv*data**hs*h~2')!;
    expect(got).toEqual({ sessionId: 'abc' });
    delete got.sessionId;
    expect(cache.get('Fe26.2*1*s*iv*data**hs*h~2')).toEqual({ sessionId: 'abc' });
    expect(cache.get('Fe26.2*1*s*iv*other**hs*h~2')).toBeUndefined();
  });

  it('forgets an entry after its time to live', () => {
    let now = 1_000_000;
    const cache = new UnsealedCookieCache<{ sessionId: string }>({ ttlMs: 60_000, now: () => now });
    cache.set('seal-a', { sessionId: 'a' });
    now += 59_999;
    expect(cache.get('seal-a')).toEqual({ sessionId: 'a' });
    now += 1;
    expect(cache.get('seal-a')).toBeUndefined();
    expect(cache.size).toBe(0);
  });

  it('never keeps an entry past the expiry written in the seal', async () => {
    const sealed = await sealData({ sessionId: 'x' }, { password, ttl: 3600 });
    const expiry = sealExpiresAt(sealed)!;
    // iron-session writes the expiry as ms since the epoch, ttl seconds from now.
    expect(Math.abs(expiry - (Date.now() + 3600_000))).toBeLessThan(5_000);
    let now = expiry - 1_000;
    const cache = new UnsealedCookieCache<{ sessionId: string }>({ ttlMs: 60_000, now: () => now });
    cache.set(sealed, { sessionId: 'x' });
    expect(cache.get(sealed)).toEqual({ sessionId: 'x' });
    now = expiry;
    expect(cache.get(sealed)).toBeUndefined();
    // A seal already expired is not stored at all.
    cache.set(sealed, { sessionId: 'x' });
    expect(cache.size).toBe(0);
    expect(await unsealData(sealed, { password, ttl: 3600 })).toEqual({ sessionId: 'x' });
  });

  it('drops the least recently used cookie beyond its size', () => {
    const cache = new UnsealedCookieCache<{ n: number }>({ maxEntries: 2 });
    cache.set('a', { n: 1 });
    cache.set('b', { n: 2 });
    expect(cache.get('a')).toEqual({ n: 1 }); // 'a' is now the most recent
    cache.set('c', { n: 3 });
    expect(cache.size).toBe(2);
    expect(cache.get('b')).toBeUndefined();
    expect(cache.get('a')).toEqual({ n: 1 });
    expect(cache.get('c')).toEqual({ n: 3 });
  });
});

describe('cookieValue', () => {
  it('reads the first cookie of that name, unquoted and percent-decoded', () => {
    expect(cookieValue('a=1; redward_session=Fe26.2*1*x~2; b=2', 'redward_session')).toBe('Fe26.2*1*x~2');
    expect(cookieValue('redward_session="q%20v"; redward_session=second', 'redward_session')).toBe('q v');
    expect(cookieValue('other_redward_session=1; x=2', 'redward_session')).toBe('');
    expect(cookieValue(undefined, 'redward_session')).toBe('');
    expect(cookieValue('redward_session=%E0%A4%A', 'redward_session')).toBe('%E0%A4%A');
  });
});
