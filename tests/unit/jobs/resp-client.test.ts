import { describe, expect, it } from 'vitest';
import { encodeCommand, parseReply, ReplyError } from '../../../backend/src/jobs/redis/resp-client';
import { redisOptionsOf } from '../../../backend/src/jobs/redis/bullmq-connection';
import { loadConfig } from '../../../backend/src/config';

// The protocol pieces of the Redis client BullMQ runs on (RESP2, as the Redis protocol
// specification describes it: https://redis.io/docs/latest/develop/reference/protocol-spec/ — from memory).
describe('RESP encoding and parsing', () => {
  it('encodes a command as an array of bulk strings, bytes kept as they are', () => {
    expect(encodeCommand(['SET', 'k', 12]).toString()).toBe('*3\r\n$3\r\nSET\r\n$1\r\nk\r\n$2\r\n12\r\n');
    const binary = encodeCommand(['SET', Buffer.from([0, 255, 13, 10])]);
    expect([...binary.subarray(binary.length - 6)]).toEqual([0, 255, 13, 10, 13, 10]);
    // Lengths count bytes, not characters.
    expect(encodeCommand(['Å']).toString()).toBe('*1\r\n$2\r\nÅ\r\n');
  });

  it('parses every reply type, nested arrays and nulls', () => {
    const buf = Buffer.from('*4\r\n+OK\r\n:42\r\n$-1\r\n*2\r\n$5\r\nhello\r\n*0\r\n');
    expect(parseReply(buf, 0)).toEqual({ reply: ['OK', 42, null, ['hello', []]], next: buf.length });
    const err = parseReply(Buffer.from('-NOSCRIPT No matching script\r\n'), 0)!.reply;
    expect(err).toBeInstanceOf(ReplyError);
    expect((err as ReplyError).message).toBe('NOSCRIPT No matching script');
  });

  it('waits for the rest of a reply split across packets, at every cut', () => {
    const whole = Buffer.from('*2\r\n$12\r\nhello\r\nworld\r\n:7\r\n+PONG\r\n');
    const first = parseReply(whole, 0)!;
    expect(first.reply).toEqual(['hello\r\nworld', 7]);
    expect(parseReply(whole, first.next)!.reply).toBe('PONG');
    for (let cut = 0; cut < first.next; cut++) expect(parseReply(whole.subarray(0, cut), 0)).toBeUndefined();
  });
});

describe('the queue setting', () => {
  it('reads redis:// addresses with credentials and database', () => {
    expect(redisOptionsOf('redis://:s%40cret@queue.lan:6380/2')).toMatchObject({ host: 'queue.lan', port: 6380, password: 's@cret', db: 2 });
    expect(redisOptionsOf('redis://127.0.0.1')).toMatchObject({ host: '127.0.0.1', port: 6379, db: 0 });
  });

  it('defaults to sqlite and refuses anything else with a sentence naming the variable', () => {
    expect(loadConfig({}).jobs.queue).toEqual({ kind: 'sqlite' });
    expect(loadConfig({ JOB_QUEUE: 'redis://10.0.0.5:6379' }).jobs.queue).toEqual({ kind: 'redis', url: 'redis://10.0.0.5:6379' });
    expect(() => loadConfig({ JOB_QUEUE: 'rabbitmq://x' })).toThrow(/JOB_QUEUE must be "sqlite" or a Redis address/);
    expect(() => loadConfig({ REDWARD_WORKER_TOKEN: 'rwpat_abc' })).toThrow(/REDWARD_WORKER_TOKEN must be a worker token/);
  });
});
