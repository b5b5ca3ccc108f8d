import type { ConnectionOptions } from 'bullmq';

/** Host, port, credentials and database of a `redis://[user:password@]host[:port][/db]` address. */
export function redisOptionsOf(url: string): { host: string; port: number; username?: string; password?: string; db: number } {
  const u = new URL(url);
  if (u.protocol !== 'redis:') throw new Error(`JOB_QUEUE must be "sqlite" or a redis:// address (TLS "rediss://" is not supported); got ${url}.`);
  const db = u.pathname.length > 1 ? Number(u.pathname.slice(1)) : 0;
  if (!Number.isSafeInteger(db) || db < 0) throw new Error(`The Redis database in ${url} must be a number.`);
  return {
    host: u.hostname || '127.0.0.1',
    port: u.port ? Number(u.port) : 6379,
    ...(u.username ? { username: decodeURIComponent(u.username) } : {}),
    ...(u.password ? { password: decodeURIComponent(u.password) } : {}),
    db,
  };
}

/**
 * What Queue, Worker and QueueEvents take as `connection` for a Redis address: options from
 * which BullMQ opens its own ioredis connections (the driver it documents). Commands wait while
 * Redis is away instead of failing after a few retries (`maxRetriesPerRequest: null`, which
 * BullMQ's workers require).
 */
export function bullConnection(url: string): ConnectionOptions {
  return { ...redisOptionsOf(url), maxRetriesPerRequest: null };
}
