/**
 * A least-recently-used map bounded by the bytes of its values, for answers that never change
 * once made (a stored file is addressed by its sha-256, a scan's curves by the scan's id). A value
 * larger than the whole budget is not kept: serving it again costs what it cost the first time,
 * but it cannot push every other entry out.
 */
export class ByteLru<V extends { byteLength: number }> {
  private readonly entries = new Map<string, V>();
  private used = 0;

  constructor(private readonly maxBytes: number) {}

  get(key: string): V | undefined {
    const value = this.entries.get(key);
    if (value === undefined) return undefined;
    // Map keeps insertion order: re-inserting marks the entry as the most recently used.
    this.entries.delete(key);
    this.entries.set(key, value);
    return value;
  }

  set(key: string, value: V): void {
    const old = this.entries.get(key);
    if (old !== undefined) {
      this.entries.delete(key);
      this.used -= old.byteLength;
    }
    if (value.byteLength > this.maxBytes) return;
    this.entries.set(key, value);
    this.used += value.byteLength;
    for (const [oldest, v] of this.entries) {
      if (this.used <= this.maxBytes) break;
      this.entries.delete(oldest);
      this.used -= v.byteLength;
    }
  }

  get bytes(): number {
    return this.used;
  }

  get size(): number {
    return this.entries.size;
  }
}

/** One cache per application context, made on first use (tests build many contexts). */
export function perContext<C extends object, T>(make: () => T): (ctx: C) => T {
  const caches = new WeakMap<C, T>();
  return (ctx) => {
    let cache = caches.get(ctx);
    if (cache === undefined) {
      cache = make();
      caches.set(ctx, cache);
    }
    return cache;
  };
}
