import { describe, expect, it } from 'vitest';
import { ByteLru } from '../../../backend/src/services/byte-lru';

const bytes = (n: number) => new Uint8Array(n);

describe('ByteLru', () => {
  it('drops the least recently used entries once the byte budget is passed', () => {
    const cache = new ByteLru<Uint8Array>(100);
    cache.set('a', bytes(40));
    cache.set('b', bytes(40));
    expect(cache.get('a')?.byteLength).toBe(40); // 'a' is now the most recent
    cache.set('c', bytes(40)); // 120 > 100: 'b' goes
    expect(cache.get('b')).toBeUndefined();
    expect(cache.get('a')).toBeDefined();
    expect(cache.get('c')).toBeDefined();
    expect(cache.bytes).toBe(80);
    expect(cache.size).toBe(2);
  });

  it('does not keep a value larger than the whole budget, and keeps what it had', () => {
    const cache = new ByteLru<Uint8Array>(100);
    cache.set('a', bytes(60));
    cache.set('huge', bytes(101));
    expect(cache.get('huge')).toBeUndefined();
    expect(cache.get('a')).toBeDefined();
    expect(cache.bytes).toBe(60);
  });

  it('replaces a key without counting it twice', () => {
    const cache = new ByteLru<Uint8Array>(100);
    cache.set('a', bytes(60));
    cache.set('a', bytes(30));
    expect(cache.bytes).toBe(30);
    expect(cache.get('a')?.byteLength).toBe(30);
  });
});
