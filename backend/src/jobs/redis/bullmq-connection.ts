import { createIORedisClient, RedisConnection, type ConnectionOptions } from 'bullmq';
import { RespClient, type RespOptions } from './resp-client';

/** Host, port, credentials and database of a `redis://[user:password@]host[:port][/db]` address. */
export function redisOptionsOf(url: string): RespOptions {
  const u = new URL(url);
  if (u.protocol !== 'redis:') throw new Error(`JOB_QUEUE must be "sqlite" or a redis:// address (TLS "rediss://" is not supported); got ${url}.`);
  const db = u.pathname.length > 1 ? Number(u.pathname.slice(1)) : 0;
  if (!Number.isSafeInteger(db) || db < 0) throw new Error(`The Redis database in ${url} must be a number.`);
  return {
    host: u.hostname || '127.0.0.1',
    port: u.port ? Number(u.port) : 6379,
    username: u.username ? decodeURIComponent(u.username) : undefined,
    password: u.password ? decodeURIComponent(u.password) : undefined,
    db,
  };
}

// BullMQ makes its connections through this factory (it has no driver of its own: see
// resp-client.ts). Its own adapter turns our client into the interface it calls.
RedisConnection.clientFactory = (opts) => createIORedisClient(new RespClient({ ...(opts as RespOptions) }) as never);

/** What Queue, Worker and QueueEvents take as `connection` for a Redis address. */
export function bullConnection(url: string): ConnectionOptions {
  return { ...redisOptionsOf(url) };
}
