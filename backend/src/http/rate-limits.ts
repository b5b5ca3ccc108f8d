import { isIPv6 } from 'node:net';
import { tooManyRequests } from './errors';

/**
 * How failed sign-ins are limited. Three counters, so that guessing from one place is slowed
 * to a crawl while a person signing in from anywhere else is not affected:
 *
 * - per client address and account (the pair): a few free failures, then each further failure
 *   doubles the wait before the next attempt, up to `pairMaxDelayMs`; forgotten after
 *   `pairMemoryMs` without a failure, or on a successful sign-in;
 * - per client address, across accounts (one machine spraying many accounts);
 * - per account, across addresses: much higher, because it is the one an attacker elsewhere could
 *   use to lock the account; when it trips the installation's admins are told.
 *
 * Values are common practice (no published source): five free tries cover honest typos, a 15-min
 * cap keeps an online guesser to ≈ 4 tries an hour per address.
 */
export interface SignInLimits {
  windowMs: number;
  pairFreeFailures: number;
  pairBaseDelayMs: number;
  pairMaxDelayMs: number;
  pairMemoryMs: number;
  perAddress: number;
  perAccount: number;
  /** Entries kept per counter before expired ones are swept and, if still over, the oldest dropped. */
  maxEntries: number;
}

const MINUTE = 60_000;

export const DEFAULT_SIGN_IN_LIMITS: SignInLimits = {
  windowMs: 15 * MINUTE,
  pairFreeFailures: 5,
  pairBaseDelayMs: 1000,
  pairMaxDelayMs: 15 * MINUTE,
  pairMemoryMs: 24 * 60 * MINUTE,
  perAddress: 50,
  perAccount: 100,
  maxEntries: 100_000,
};

export type LimitScope = 'pair' | 'address' | 'account';

export interface Refusal {
  scope: LimitScope;
  /** Milliseconds until the next attempt is allowed. */
  retryAfterMs: number;
}

interface Window {
  count: number;
  startedAt: number;
  /** The admins were told about this window already. */
  alerted: boolean;
}

interface PairState {
  failures: number;
  lastFailureAt: number;
}

/**
 * In-memory failure counters for one process, on an injected clock (tests move it). A restart
 * forgets them, which costs an attacker nothing they could not get by waiting 15 minutes.
 */
export class SignInLimiter {
  private readonly pairs = new Map<string, PairState>();
  private readonly addresses = new Map<string, Window>();
  private readonly accounts = new Map<string, Window>();

  constructor(
    private readonly now: () => Date,
    readonly limits: SignInLimits = DEFAULT_SIGN_IN_LIMITS,
  ) {}

  /**
   * Asks to try a password. Null when the attempt may go ahead (it is then counted as a failure
   * until `succeeded` says otherwise, so parallel guesses cannot slip past the backoff), else which
   * limit holds it back and for how long.
   */
  attempt(address: string, account: string): Refusal | null {
    const t = this.now().getTime();
    const refusal = this.refusal(address, account, t);
    if (refusal) return refusal;
    const key = pairKey(address, account);
    const pair = this.livePair(key, t);
    touch(this.pairs, key, { failures: (pair?.failures ?? 0) + 1, lastFailureAt: t }, this.limits.maxEntries, (p) => t - p.lastFailureAt >= this.limits.pairMemoryMs);
    this.countInWindow(this.addresses, address, t);
    this.countInWindow(this.accounts, account, t);
    return null;
  }

  /**
   * The attempt was a wrong password (it is already counted). `alertDue` is true once per window,
   * on the first failure that finds the account at its limit: the admins are to be told.
   */
  failed(account: string): { alertDue: boolean; accountFailures: number } {
    const w = this.accounts.get(account);
    if (!w || w.count < this.limits.perAccount || w.alerted) return { alertDue: false, accountFailures: w?.count ?? 0 };
    w.alerted = true;
    return { alertDue: true, accountFailures: w.count };
  }

  /** The right password: this address's typos for the account are forgiven and the attempt uncounted. */
  succeeded(address: string, account: string): void {
    this.pairs.delete(pairKey(address, account));
    const t = this.now().getTime();
    for (const [map, key] of [[this.addresses, address], [this.accounts, account]] as const) {
      const w = map.get(key);
      if (w && t - w.startedAt < this.limits.windowMs && w.count > 0) w.count -= 1;
    }
  }

  private refusal(address: string, account: string, t: number): Refusal | null {
    const refusals: Refusal[] = [];
    const pair = this.livePair(pairKey(address, account), t);
    if (pair) {
      const wait = pair.lastFailureAt + this.pairDelay(pair.failures) - t;
      if (wait > 0) refusals.push({ scope: 'pair', retryAfterMs: wait });
    }
    const byAddress = this.windowRefusal(this.addresses.get(address), this.limits.perAddress, t);
    if (byAddress > 0) refusals.push({ scope: 'address', retryAfterMs: byAddress });
    const byAccount = this.windowRefusal(this.accounts.get(account), this.limits.perAccount, t);
    if (byAccount > 0) refusals.push({ scope: 'account', retryAfterMs: byAccount });
    if (refusals.length === 0) return null;
    return refusals.reduce((a, b) => (b.retryAfterMs > a.retryAfterMs ? b : a));
  }

  private livePair(key: string, t: number): PairState | undefined {
    const pair = this.pairs.get(key);
    return pair && t - pair.lastFailureAt < this.limits.pairMemoryMs ? pair : undefined;
  }

  /** The wait imposed after `failures` consecutive failures of one pair. */
  pairDelay(failures: number): number {
    const beyond = failures - this.limits.pairFreeFailures;
    if (beyond < 0) return 0;
    return Math.min(this.limits.pairMaxDelayMs, this.limits.pairBaseDelayMs * 2 ** Math.min(beyond, 40));
  }

  /** How many entries each counter holds (for the memory-bound test). */
  sizes(): { pairs: number; addresses: number; accounts: number } {
    return { pairs: this.pairs.size, addresses: this.addresses.size, accounts: this.accounts.size };
  }

  private windowRefusal(w: Window | undefined, limit: number, t: number): number {
    if (!w || t - w.startedAt >= this.limits.windowMs || w.count < limit) return 0;
    return w.startedAt + this.limits.windowMs - t;
  }

  private countInWindow(map: Map<string, Window>, key: string, t: number): number {
    const w = map.get(key);
    const next = w && t - w.startedAt < this.limits.windowMs ? { ...w, count: w.count + 1 } : { count: 1, startedAt: t, alerted: false };
    touch(map, key, next, this.limits.maxEntries, (e) => t - e.startedAt >= this.limits.windowMs);
    return next.count;
  }
}

/**
 * Stores `value` as the newest entry. Over the bound, expired entries are swept, and if that is
 * not enough the oldest (least recently failed) go: a flood of made-up addresses or accounts cannot grow memory without end.
 */
function touch<V>(map: Map<string, V>, key: string, value: V, maxEntries: number, expired: (v: V) => boolean): void {
  map.delete(key);
  map.set(key, value);
  if (map.size <= maxEntries) return;
  // Down to 90 %, so the sweep (one pass) runs once per tenth of the bound, not on every insert.
  const keep = Math.floor(maxEntries * 0.9);
  for (const [k, v] of map) if (expired(v)) map.delete(k);
  for (const k of map.keys()) {
    if (map.size <= keep) break;
    map.delete(k);
  }
}

const pairKey = (address: string, account: string) => `${address}\n${account}`;

/**
 * The address a limit is kept for: IPv4 as it is (IPv4-mapped IPv6 unwrapped), IPv6 by its /64,
 * since one machine usually holds a whole /64 and could otherwise step through it.
 */
export function clientAddressKey(ip: string | undefined): string {
  if (!ip) return 'unknown';
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(ip);
  if (mapped) return mapped[1]!;
  if (!isIPv6(ip)) return ip;
  return `${expandIPv6(ip).slice(0, 4).join(':')}::/64`;
}

function expandIPv6(ip: string): string[] {
  const [head = '', tail = ''] = ip.split('%')[0]!.split('::');
  const left = head ? head.split(':') : [];
  const right = ip.includes('::') ? (tail ? tail.split(':') : []) : [];
  const groups = ip.includes('::') ? [...left, ...Array(8 - left.length - right.length).fill('0'), ...right] : left;
  return groups.map((g) => g.toLowerCase().replace(/^0+(?=.)/, ''));
}

/** The 429 answer for a refusal, with a wait a person can read and a Retry-After header. */
export function signInRefused(refusal: Refusal) {
  const seconds = Math.max(1, Math.ceil(refusal.retryAfterMs / 1000));
  const wait = seconds < 60 ? `${seconds} second${seconds === 1 ? '' : 's'}` : `${Math.ceil(seconds / 60)} minute${Math.ceil(seconds / 60) === 1 ? '' : 's'}`;
  const why =
    refusal.scope === 'account'
      ? 'Too many failed sign-in attempts for this account from many places; the administrators have been told.'
      : 'Too many failed sign-in attempts.';
  return tooManyRequests(`${why} Try again in ${wait}.`, seconds);
}
