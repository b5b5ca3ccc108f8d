import { createHash } from 'node:crypto';

export interface UnsealedCookieCacheOptions {
  /** Most cookies remembered; the least recently used is dropped beyond this. */
  maxEntries?: number;
  /** How long an unsealed cookie is remembered, ms. */
  ttlMs?: number;
  now?: () => number;
}

interface Entry<T> {
  data: T;
  expiresAt: number;
}

/**
 * What sealed session cookies unsealed to, so a browser's every request does not pay for
 * iron-session's unseal again (key derivation, HMAC check and AES, ≈ 0.35 ms on this host; issue
 * 13's load benchmark). Only the cookie's content is remembered — which session id it carries —
 * never whether that session still counts: the caller checks the session row on every request,
 * so signing out still ends a session at once.
 *
 * Keyed by the sha-256 of the sealed string (the cookie itself, a bearer secret, is not kept),
 * bounded in entries (least recently used dropped first) and in time: an entry lives `ttlMs` and
 * never past the seal's own expiry, read from the seal (iron's format: `Fe26.2*id*salt*iv*data*
 * expiration*hmacSalt*hmac`, expiration in ms since the epoch; from memory of iron-webcrypto). A
 * string is only ever remembered after the library unsealed it, so a forged or altered cookie
 * can never be served from here.
 */
export class UnsealedCookieCache<T extends object> {
  private readonly entries = new Map<string, Entry<T>>();
  private readonly maxEntries: number;
  private readonly ttlMs: number;
  private readonly now: () => number;

  constructor(options: UnsealedCookieCacheOptions = {}) {
    this.maxEntries = options.maxEntries ?? 2000;
    this.ttlMs = options.ttlMs ?? 60_000;
    this.now = options.now ?? Date.now;
  }

  get size(): number {
    return this.entries.size;
  }

  /** A copy of what `sealed` unsealed to, or undefined when it is not (or no longer) remembered. */
  get(sealed: string): T | undefined {
    const key = keyOf(sealed);
    const entry = this.entries.get(key);
    if (!entry) return undefined;
    this.entries.delete(key);
    if (entry.expiresAt <= this.now()) return undefined;
    // Re-inserted: a Map iterates in insertion order, so the first key is the least recently used.
    this.entries.set(key, entry);
    return structuredClone(entry.data);
  }

  /** Remembers what `sealed` unsealed to (a copy: the caller's session object changes later). */
  set(sealed: string, data: T): void {
    const now = this.now();
    const sealExpiry = sealExpiresAt(sealed);
    const expiresAt = Math.min(now + this.ttlMs, sealExpiry ?? now + this.ttlMs);
    if (expiresAt <= now) return;
    const key = keyOf(sealed);
    this.entries.delete(key);
    this.entries.set(key, { data: structuredClone(data), expiresAt });
    while (this.entries.size > this.maxEntries) this.entries.delete(this.entries.keys().next().value!);
  }
}

function keyOf(sealed: string): string {
  return createHash('sha256').update(sealed).digest('base64url');
}

/** The expiry written in an iron seal, ms since the epoch; null when it has none (ttl 0) or cannot be read. */
export function sealExpiresAt(sealed: string): number | null {
  const parts = sealed.split('~')[0]!.split('*');
  if (parts.length !== 8) return null;
  const expiration = Number(parts[5]);
  return parts[5] !== '' && Number.isFinite(expiration) && expiration > 0 ? expiration : null;
}
