import { spawn, type ChildProcess } from 'node:child_process';
import { createServer, connect } from 'node:net';

/** A port nobody listens on right now (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

export interface TestRedis {
  url: string;
  port: number;
  process: ChildProcess;
  stop(): Promise<void>;
}

/**
 * Debian's redis-server as a child process on a free port, with nothing written to disk. Tests
 * never rely on a system service; CI installs the package (.ci/run).
 */
export async function startRedis(): Promise<TestRedis> {
  const port = await freePort();
  const child = spawn('redis-server', ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'], { stdio: 'ignore' });
  const spawnError = new Promise<never>((_, reject) => child.once('error', (err) => reject(new Error(`redis-server did not start (${err.message}); install it: apt-get install -y redis-server`))));
  const deadline = Date.now() + 10_000;
  for (;;) {
    const up = await Promise.race([
      spawnError,
      new Promise<boolean>((resolve) => {
        const socket = connect(port, '127.0.0.1', () => {
          socket.destroy();
          resolve(true);
        });
        socket.once('error', () => resolve(false));
      }),
    ]);
    if (up) break;
    if (Date.now() > deadline) throw new Error(`redis-server did not listen on port ${port} within 10 s`);
    await new Promise((r) => setTimeout(r, 50));
  }
  return {
    url: `redis://127.0.0.1:${port}`,
    port,
    process: child,
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}
