import { describe, expect, it } from 'vitest';
import { clientAddressKey, DEFAULT_SIGN_IN_LIMITS, SignInLimiter, signInRefused } from '../../../backend/src/http/rate-limits';

function limiter(overrides: Partial<typeof DEFAULT_SIGN_IN_LIMITS> = {}) {
  const clock = { t: Date.parse('2025-03-01T12:00:00Z') };
  const l = new SignInLimiter(() => new Date(clock.t), { ...DEFAULT_SIGN_IN_LIMITS, ...overrides });
  const fail = (address: string, account: string) => {
    const refusal = l.attempt(address, account);
    if (refusal) return refusal;
    l.failed(account);
    return null;
  };
  return { l, clock, fail, advance: (ms: number) => (clock.t += ms) };
}

describe('SignInLimiter', () => {
  it('gives a pair five free failures, then doubles the wait: 1, 2, 4 … s, capped at 15 min', () => {
    const { l, fail, advance } = limiter();
    for (let i = 0; i < 5; i++) expect(fail('198.51.100.7', 'lead@demo.test')).toBeNull();
    const first = l.attempt('198.51.100.7', 'lead@demo.test');
    expect(first).toEqual({ scope: 'pair', retryAfterMs: 1000 });
    advance(1000);
    expect(fail('198.51.100.7', 'lead@demo.test')).toBeNull();
    expect(l.attempt('198.51.100.7', 'lead@demo.test')).toEqual({ scope: 'pair', retryAfterMs: 2000 });
    advance(2000);
    expect(fail('198.51.100.7', 'lead@demo.test')).toBeNull();
    expect(l.attempt('198.51.100.7', 'lead@demo.test')!.retryAfterMs).toBe(4000);
    expect([5, 6, 7, 10, 14, 15, 40].map((f) => l.pairDelay(f))).toEqual([1000, 2000, 4000, 32_000, 512_000, 900_000, 900_000]);
  });

  it('does not hold back the same account from another address', () => {
    const { l, fail } = limiter();
    for (let i = 0; i < 7; i++) fail('198.51.100.7', 'lead@demo.test');
    expect(l.attempt('198.51.100.7', 'lead@demo.test')?.scope).toBe('pair');
    expect(l.attempt('203.0.113.20', 'lead@demo.test')).toBeNull();
  });

  it('forgives a pair on success and forgets it after a day without failures', () => {
    const { l, fail, advance } = limiter();
    for (let i = 0; i < 5; i++) fail('198.51.100.7', 'a@x.test');
    advance(1000);
    expect(l.attempt('198.51.100.7', 'a@x.test')).toBeNull();
    l.succeeded('198.51.100.7', 'a@x.test');
    for (let i = 0; i < 5; i++) expect(fail('198.51.100.7', 'a@x.test')).toBeNull();
    advance(24 * 3600_000);
    for (let i = 0; i < 5; i++) expect(fail('198.51.100.7', 'a@x.test')).toBeNull();
  });

  it('counts parallel attempts before their passwords are checked', () => {
    const { l } = limiter();
    // Six guesses arriving together: the sixth is refused although none has failed yet.
    const answers = Array.from({ length: 6 }, () => l.attempt('198.51.100.7', 'a@x.test'));
    expect(answers.slice(0, 5)).toEqual([null, null, null, null, null]);
    expect(answers[5]?.scope).toBe('pair');
  });

  it('limits one address spraying many accounts to 50 failures per 15 minutes', () => {
    const { l, fail, advance } = limiter();
    for (let i = 0; i < 50; i++) expect(fail('198.51.100.7', `user${i}@x.test`)).toBeNull();
    const refusal = l.attempt('198.51.100.7', 'fresh@x.test');
    expect(refusal).toEqual({ scope: 'address', retryAfterMs: 15 * 60_000 });
    expect(l.attempt('203.0.113.20', 'fresh@x.test')).toBeNull();
    advance(15 * 60_000);
    expect(l.attempt('198.51.100.7', 'fresh@x.test')).toBeNull();
  });

  it('stops an account after 100 failures from many addresses and asks for one alert per window', () => {
    const { l, advance } = limiter();
    const alerts: number[] = [];
    for (let i = 0; i < 100; i++) {
      const address = `10.0.${Math.floor(i / 4)}.${i % 4}`;
      expect(l.attempt(address, 'admin@demo.test')).toBeNull();
      const { alertDue, accountFailures } = l.failed('admin@demo.test');
      if (alertDue) alerts.push(accountFailures);
    }
    expect(alerts).toEqual([100]);
    const refusal = l.attempt('192.0.2.1', 'admin@demo.test');
    expect(refusal).toEqual({ scope: 'account', retryAfterMs: 15 * 60_000 });
    expect(l.failed('admin@demo.test').alertDue).toBe(false);
    // Other accounts are unaffected; the next window starts afresh (and may alert again).
    expect(l.attempt('192.0.2.1', 'lead@demo.test')).toBeNull();
    advance(15 * 60_000);
    expect(l.attempt('192.0.2.1', 'admin@demo.test')).toBeNull();
  });

  it('a success does not count towards the address and account limits', () => {
    const { l } = limiter({ perAccount: 3 });
    for (let i = 0; i < 10; i++) {
      expect(l.attempt(`10.0.0.${i}`, 'a@x.test')).toBeNull();
      l.succeeded(`10.0.0.${i}`, 'a@x.test');
    }
  });

  it('keeps memory bounded under a flood of made-up accounts', () => {
    const { l, fail } = limiter({ maxEntries: 1000, perAddress: 1e9 });
    for (let i = 0; i < 5000; i++) fail(`10.${i >> 16}.${(i >> 8) & 255}.${i & 255}`, `nobody${i}@x.test`);
    const sizes = l.sizes();
    expect(Math.max(sizes.pairs, sizes.addresses, sizes.accounts)).toBeLessThanOrEqual(1000);
  });
});

describe('clientAddressKey', () => {
  it('unwraps IPv4-mapped addresses and groups IPv6 by /64', () => {
    expect(clientAddressKey('::ffff:127.0.0.1')).toBe('127.0.0.1');
    expect(clientAddressKey('203.0.113.9')).toBe('203.0.113.9');
    expect(clientAddressKey('2001:db8:1:2:aaaa::1')).toBe('2001:db8:1:2::/64');
    expect(clientAddressKey('2001:db8:1:2:bbbb:cccc:dddd:eeee')).toBe('2001:db8:1:2::/64');
    expect(clientAddressKey('2001:db8::1')).toBe('2001:db8:0:0::/64');
    expect(clientAddressKey(undefined)).toBe('unknown');
  });
});

describe('signInRefused', () => {
  it('says how long to wait in words and in Retry-After', () => {
    const short = signInRefused({ scope: 'pair', retryAfterMs: 1500 });
    expect(short.status).toBe(429);
    expect(short.message).toBe('Too many failed sign-in attempts. Try again in 2 seconds.');
    expect(short.headers['Retry-After']).toBe('2');
    const long = signInRefused({ scope: 'account', retryAfterMs: 14 * 60_000 + 1 });
    expect(long.message).toMatch(/administrators have been told\. Try again in 15 minutes\.$/);
    expect(long.headers['Retry-After']).toBe('841');
  });
});
