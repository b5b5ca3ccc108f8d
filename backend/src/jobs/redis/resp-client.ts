import { createHash } from 'node:crypto';
import { EventEmitter } from 'node:events';
import { connect, type Socket } from 'node:net';
import { Readable } from 'node:stream';

/*
 * A small Redis client speaking RESP2 over one TCP connection, shaped like the client BullMQ's own
 * adapter (`createIORedisClient`) wraps: every command is a method, replies keep Redis' own shapes
 * (hgetall as an object), `defineCommand` registers a Lua script, `pipeline()`/`multi()` batch.
 *
 * Why it exists: bullmq 6 takes its Redis driver as an optional peer package and none is installed
 * here. This covers exactly what BullMQ calls (see jobs/redis/README in docs/decisions/job-queue.md);
 * swapping in a full driver later is one line in bullmq-connection.ts.
 */

export interface RespOptions {
  host: string;
  port: number;
  username?: string | undefined;
  password?: string | undefined;
  db?: number | undefined;
  /** Milliseconds before the next connection attempt; null stops retrying. */
  retryStrategy?: (times: number) => number | null | void;
  [key: string]: unknown;
}

export class ReplyError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ReplyError';
  }
}

/** The message BullMQ recognises as "the connection closed" (not a failure of a command). */
export const CONNECTION_CLOSED = 'Connection is closed.';

type Arg = string | number | Buffer;
type Reply = string | number | null | ReplyError | Reply[];
interface Pending {
  resolve: (reply: Reply) => void;
  reject: (err: Error) => void;
}

const CRLF = Buffer.from('\r\n');

/**
 * Commands callable as methods (client.hget(…)). A fixed list, not "any property", so probing a
 * client (`await client`, util.inspect) never sends a command named `then` to the server.
 */
const COMMANDS = new Set(
  (
    'get set del exists expire pexpire ttl pttl type keys scan incr incrby decr ping echo info client config time ' +
    'hget hmget hset hdel hexists hgetall hscan hincrby hkeys hlen ' +
    'zadd zrem zrange zrevrange zrangebyscore zcard zscore zcount zpopmin bzpopmin ' +
    'lpush rpush lpop rpop lrange llen ltrim lpos lrem lmove blmove ' +
    'sadd srem smembers scard sismember sscan ' +
    'xadd xread xtrim xlen xrange xrevrange xdel ' +
    'publish flushall flushdb dbsize script eval evalsha'
  ).split(' '),
);

export function encodeCommand(args: readonly Arg[]): Buffer {
  const parts: Buffer[] = [Buffer.from(`*${args.length}\r\n`)];
  for (const arg of args) {
    const bytes = Buffer.isBuffer(arg) ? arg : Buffer.from(String(arg), 'utf8');
    parts.push(Buffer.from(`$${bytes.length}\r\n`), bytes, CRLF);
  }
  return Buffer.concat(parts);
}

/**
 * Parses one reply starting at `offset`; undefined when the buffer does not yet hold all of it.
 * Bulk strings come back as UTF-8 text (BullMQ stores text and msgpack it reads back through Lua).
 */
export function parseReply(buf: Buffer, offset: number): { reply: Reply; next: number } | undefined {
  if (offset >= buf.length) return undefined;
  const lineEnd = buf.indexOf(CRLF, offset);
  if (lineEnd < 0) return undefined;
  const type = buf[offset];
  const line = buf.toString('utf8', offset + 1, lineEnd);
  const after = lineEnd + 2;
  switch (type) {
    case 0x2b: // +
      return { reply: line, next: after };
    case 0x2d: // -
      return { reply: new ReplyError(line), next: after };
    case 0x3a: // :
      return { reply: Number(line), next: after };
    case 0x24: {
      // $
      const length = Number(line);
      if (length < 0) return { reply: null, next: after };
      if (buf.length < after + length + 2) return undefined;
      return { reply: buf.toString('utf8', after, after + length), next: after + length + 2 };
    }
    case 0x2a: {
      // *
      const count = Number(line);
      if (count < 0) return { reply: null, next: after };
      const items: Reply[] = [];
      let at = after;
      for (let i = 0; i < count; i++) {
        const item = parseReply(buf, at);
        if (!item) return undefined;
        items.push(item.reply);
        at = item.next;
      }
      return { reply: items, next: at };
    }
    default:
      throw new ReplyError(`Unexpected byte ${type} in a Redis reply.`);
  }
}

const flatten = (args: unknown[]): Arg[] =>
  args.flatMap((a) => (Array.isArray(a) ? flatten(a) : a === undefined || a === null ? [''] : Buffer.isBuffer(a) ? [a] : [typeof a === 'number' ? a : String(a)]));

/** Reply shapes that differ from the raw protocol, as BullMQ expects them from its driver. */
function shape(command: string, reply: Reply): unknown {
  if (command === 'hgetall' && Array.isArray(reply)) {
    const out: Record<string, unknown> = {};
    for (let i = 0; i + 1 < reply.length; i += 2) out[String(reply[i])] = reply[i + 1];
    return out;
  }
  return reply;
}

interface Script {
  sha: string;
  lua: string;
  numberOfKeys: number;
}

class Batch {
  private readonly commands: { name: string; args: Arg[] }[] = [];

  constructor(
    private readonly client: RespClient,
    private readonly transaction: boolean,
  ) {
    return new Proxy(this, {
      get: (target, prop, receiver) => {
        if (typeof prop !== 'string' || prop in target) return Reflect.get(target, prop, receiver);
        const script = client.scripts.get(prop);
        if (!script && !COMMANDS.has(prop)) return undefined;
        return (...args: unknown[]) => {
          if (script) {
            const flat = flatten(args);
            target.commands.push({ name: 'evalsha', args: [script.sha, script.numberOfKeys, ...flat] });
          } else target.commands.push({ name: prop, args: flatten(args) });
          return receiver;
        };
      },
    });
  }

  get length(): number {
    return this.commands.length;
  }

  /** `[error, reply]` per command, as BullMQ's driver answers a pipeline. */
  async exec(): Promise<[Error | null, unknown][]> {
    const commands = this.commands.splice(0);
    if (commands.length === 0) return [];
    // Scripts a pipeline runs by hash must be known to the server first.
    for (const c of commands) if (c.name === 'evalsha') await this.client.ensureScript(String(c.args[0]));
    if (!this.transaction) {
      const settled = await Promise.allSettled(commands.map((c) => this.client.send(c.name, c.args)));
      return settled.map((s, i) => (s.status === 'fulfilled' ? [null, shape(commands[i]!.name, s.value as Reply)] : [s.reason as Error, null]));
    }
    const queued = [this.client.send('multi', []), ...commands.map((c) => this.client.send(c.name, c.args).catch((err: Error) => err))];
    const exec = this.client.send('exec', []);
    await Promise.all(queued);
    const replies = (await exec) as Reply[] | null;
    if (replies === null) return [];
    return replies.map((r, i) => (r instanceof ReplyError ? [r, null] : [null, shape(commands[i]!.name, r)]));
  }
}

export class RespClient extends EventEmitter {
  status: 'wait' | 'connecting' | 'connect' | 'ready' | 'reconnecting' | 'end' = 'wait';
  readonly isCluster = false;
  readonly scripts = new Map<string, Script>();
  private socket: Socket | null = null;
  private readonly pending: Pending[] = [];
  /** Commands sent while not connected; written once the connection is ready. */
  private offline: { bytes: Buffer; waiter: Pending }[] = [];
  private buffer: Buffer = Buffer.alloc(0);
  private attempts = 0;
  private closing = false;
  private reconnectTimer: NodeJS.Timeout | null = null;
  private readonly loadedScripts = new Set<string>();

  constructor(readonly options: RespOptions) {
    super();
    return new Proxy(this, {
      get: (target, prop, receiver) => {
        if (typeof prop !== 'string' || prop in target) return Reflect.get(target, prop, receiver);
        // Any other lowercase name is a Redis command: client.hget(key, field) → HGET key field.
        if (!COMMANDS.has(prop)) return undefined;
        return (...args: unknown[]) => target.call(prop, ...args);
      },
    });
  }

  connect(): Promise<void> {
    if (this.status === 'ready') return Promise.resolve();
    this.closing = false;
    return new Promise((resolve, reject) => {
      const onReady = () => {
        this.off('error', onError);
        resolve();
      };
      const onError = (err: Error) => {
        if (this.attempts > 0 && this.status !== 'end') return; // retrying: wait for ready
        this.off('ready', onReady);
        reject(err);
      };
      this.once('ready', onReady);
      this.once('error', onError);
      this.open();
    });
  }

  private open(): void {
    this.status = this.attempts === 0 ? 'connecting' : 'reconnecting';
    const socket = connect({ host: this.options.host, port: this.options.port });
    this.socket = socket;
    socket.setNoDelay(true);
    socket.on('data', (chunk: Buffer) => this.onData(chunk));
    socket.on('error', (err) => this.emit('error', err));
    socket.on('close', () => this.onClose(socket));
    socket.on('connect', () => {
      this.status = 'connect';
      this.emit('connect');
      void this.handshake(socket);
    });
  }

  private async handshake(socket: Socket): Promise<void> {
    try {
      const direct = (args: Arg[]) =>
        new Promise<Reply>((resolve, reject) => {
          this.pending.push({ resolve, reject });
          socket.write(encodeCommand(args));
        });
      const check = (r: Reply) => {
        if (r instanceof ReplyError) throw r;
      };
      if (this.options.password) check(await direct(this.options.username ? ['AUTH', this.options.username, this.options.password] : ['AUTH', this.options.password]));
      if (this.options.db) check(await direct(['SELECT', this.options.db]));
      this.attempts = 0;
      this.loadedScripts.clear();
      this.status = 'ready';
      const queued = this.offline;
      this.offline = [];
      for (const { bytes, waiter } of queued) {
        this.pending.push(waiter);
        socket.write(bytes);
      }
      this.emit('ready');
    } catch (err) {
      this.emit('error', err as Error);
      socket.destroy();
    }
  }

  private onData(chunk: Buffer): void {
    this.buffer = this.buffer.length === 0 ? chunk : Buffer.concat([this.buffer, chunk]);
    let offset = 0;
    for (;;) {
      const parsed = parseReply(this.buffer, offset);
      if (!parsed) break;
      offset = parsed.next;
      const waiter = this.pending.shift();
      if (!waiter) continue;
      if (parsed.reply instanceof ReplyError) waiter.reject(parsed.reply);
      else waiter.resolve(parsed.reply);
    }
    this.buffer = offset === this.buffer.length ? Buffer.alloc(0) : this.buffer.subarray(offset);
  }

  private onClose(socket: Socket): void {
    if (socket !== this.socket) return;
    this.socket = null;
    this.buffer = Buffer.alloc(0);
    // Replies that will never come: the commands failed with the connection.
    for (const waiter of this.pending.splice(0)) waiter.reject(new Error(CONNECTION_CLOSED));
    this.emit('close');
    const delay = this.closing ? null : (this.options.retryStrategy ?? ((n: number) => Math.min(n * 200, 2000)))(++this.attempts);
    if (typeof delay !== 'number') {
      this.end();
      return;
    }
    this.status = 'reconnecting';
    this.emit('reconnecting', delay);
    this.reconnectTimer = setTimeout(() => {
      this.reconnectTimer = null;
      if (!this.closing) this.open();
    }, delay);
  }

  private end(): void {
    if (this.status === 'end') return;
    this.status = 'end';
    for (const waiter of this.pending.splice(0)) waiter.reject(new Error(CONNECTION_CLOSED));
    for (const { waiter } of this.offline.splice(0)) waiter.reject(new Error(CONNECTION_CLOSED));
    this.emit('end');
  }

  /** Sends one command; the promise settles with its reply. */
  send(command: string, args: Arg[]): Promise<Reply> {
    if (this.status === 'end') return Promise.reject(new Error(CONNECTION_CLOSED));
    return new Promise((resolve, reject) => {
      const bytes = encodeCommand([command.toUpperCase(), ...args]);
      if (this.status === 'ready' && this.socket) {
        this.pending.push({ resolve, reject });
        this.socket.write(bytes);
      } else {
        // Queued in order; its reply is awaited once the bytes are written, after the handshake.
        this.offline.push({ bytes, waiter: { resolve, reject } });
        if (this.status === 'wait') this.open();
      }
    });
  }

  async call(command: string, ...args: unknown[]): Promise<unknown> {
    return shape(command, await this.send(command, flatten(args)));
  }

  defineCommand(name: string, definition: { numberOfKeys: number; lua: string }): void {
    const sha = createHash('sha1').update(definition.lua).digest('hex');
    this.scripts.set(name, { sha, lua: definition.lua, numberOfKeys: definition.numberOfKeys });
    // BullMQ checks for the property and calls client[name](args) with KEYS then ARGV in one array.
    (this as unknown as Record<string, unknown>)[name] = (...args: unknown[]) => this.runScript(sha, flatten(args));
  }

  async ensureScript(sha: string): Promise<void> {
    if (this.loadedScripts.has(sha)) return;
    const script = [...this.scripts.values()].find((s) => s.sha === sha);
    if (!script) return;
    await this.send('script', ['LOAD', script.lua]);
    this.loadedScripts.add(sha);
  }

  private async runScript(sha: string, args: Arg[]): Promise<unknown> {
    const script = [...this.scripts.values()].find((s) => s.sha === sha)!;
    try {
      return await this.send('evalsha', [sha, script.numberOfKeys, ...args]);
    } catch (err) {
      if (!(err instanceof ReplyError) || !err.message.startsWith('NOSCRIPT')) throw err;
      const reply = await this.send('eval', [script.lua, script.numberOfKeys, ...args]);
      this.loadedScripts.add(sha);
      return reply;
    }
  }

  pipeline(): Batch {
    return new Batch(this, false);
  }

  multi(): Batch {
    return new Batch(this, true);
  }

  duplicate(overrides: Partial<RespOptions> = {}): RespClient {
    return new RespClient({ ...this.options, ...overrides });
  }

  /** Iterates SCAN as a stream of key arrays (BullMQ uses it to empty a queue). */
  scanStream(options: { match?: string; count?: number } = {}): Readable {
    let cursor: string | null = '0';
    const stream: Readable = new Readable({
      objectMode: true,
      read: () => {
        if (cursor === null) return;
        const args: Arg[] = [cursor];
        if (options.match) args.push('MATCH', options.match);
        if (options.count) args.push('COUNT', options.count);
        this.send('scan', args).then(
          (reply) => {
            const [next, keys] = reply as [string, string[]];
            cursor = next === '0' ? null : next;
            stream.push(keys);
            if (cursor === null) stream.push(null);
          },
          (err: Error) => stream.destroy(err),
        );
      },
    });
    return stream;
  }

  async quit(): Promise<string> {
    this.closing = true;
    if (this.reconnectTimer) clearTimeout(this.reconnectTimer);
    if (this.status !== 'ready' || !this.socket) {
      this.disconnect();
      return 'OK';
    }
    const socket = this.socket;
    const reply = await this.send('quit', []).catch(() => 'OK');
    socket.end();
    return String(reply);
  }

  disconnect(reconnect = false): void {
    this.closing = !reconnect;
    if (this.reconnectTimer) clearTimeout(this.reconnectTimer);
    this.reconnectTimer = null;
    if (this.socket) this.socket.destroy();
    else if (!reconnect) this.end();
  }
}
