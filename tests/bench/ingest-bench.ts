import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { loadConfig } from '../../backend/src/config';
import { startServer } from '../../backend/src/server';
import { createWorkerToken } from '../../backend/src/services/worker-tokens';
import { startRedis, type TestRedis } from '../helpers/redis-server';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';

/**
 * `npm run bench:ingest -- [--spectra 2000] [--workers N] [--json]`: wall time from the start of one
 * HTTP upload of a zip of generated 4,000-pixel spectra to the moment every spectrum is stored and
 * scanned, on this machine's cores.
 *
 * With `--workers N` it runs twice: the embedded queue (the server's own scan threads), then the
 * Redis queue (redis-server, the server dispatching to BullMQ, N `npm run jobs` worker processes
 * sharing this machine's cores), and prints spectra/s side by side with the per-item costs that
 * decide how far the Redis queue scales: the server's CPU per item (serving the file, recording
 * the result), Redis' CPU per item, and each worker's fetch / scan / post times. The last line is
 * JSON with every figure.
 */
const { values } = parseArgs({
  options: {
    spectra: { type: 'string', default: '2000' },
    workers: { type: 'string' },
    // Only the Redis run (for profiling the server's side of it).
    'redis-only': { type: 'boolean', default: false },
    json: { type: 'boolean', default: false },
  },
});
const count = Number(values.spectra);
const workerCount = values.workers === undefined ? 0 : Number(values.workers);
if (!Number.isSafeInteger(count) || count <= 0 || !Number.isSafeInteger(workerCount) || workerCount < 0) {
  console.error('Usage: npm run bench:ingest -- [--spectra 2000] [--workers N] [--json]');
  process.exit(2);
}
const cores = availableParallelism();
const say = (line: string) => {
  if (!values.json) console.log(line);
};

const genStart = performance.now();
const archive = zip(syntheticSpectrumFiles(count, { pixels: 4000, prefix: 'BENCH' }));
say(`generated ${count} spectra in ${((performance.now() - genStart) / 1000).toFixed(1)} s (${(archive.length / 1024 / 1024).toFixed(1)} MB zip, not timed)`);

interface Run {
  queue: 'embedded' | 'redis';
  uploadSeconds: number;
  seconds: number;
  spectraPerSecond: number;
  stored: number;
  failed: number;
  state: string;
  /** CPU of the server process after the upload (main thread plus, for the embedded queue, its scan threads) per spectrum. */
  serverCpuMsPerSpectrum: number;
  /**
   * CPU of the server's main thread per spectrum: what caps the Redis queue, since every result is
   * recorded there. Includes this benchmark's own progress polls (4 a second).
   */
  serverMainThreadMsPerSpectrum: number;
}

async function ingest(env: Record<string, string>, onServer?: (s: Awaited<ReturnType<typeof startServer>>) => Promise<void>): Promise<Omit<Run, 'queue'>> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'redward-bench-'));
  const server = await startServer(
    loadConfig({ DATA_DIR: dataDir, PORT: '0', HOST: '127.0.0.1', LOG_LEVEL: 'silent', MAIL_CATCHER_PORT: '0', REDWARD_DEMO_SPECTRA: '0', UPLOAD_MAX_TOTAL_MB: '4096', UPLOAD_MAX_FILE_MB: '4096', ...env }),
  );
  try {
    await onServer?.(server);
    const origin = server.url;
    const login = await fetch(`${origin}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: 'lead@demo.test', password: 'redward-demo' }) });
    const cookie = login.headers.get('set-cookie')!.split(';')[0]!;
    const headers = { cookie, origin };
    const form = new FormData();
    form.append('files', new Blob([new Uint8Array(archive)]), 'bench.zip');
    const start = performance.now();
    const upload = await fetch(`${origin}/api/campaigns/1/uploads`, { method: 'POST', headers, body: form });
    const receipt = (await upload.json()) as { jobId: number };
    const uploadSeconds = (performance.now() - start) / 1000;
    // CPU from here on: the scanning phase (the upload's expanding and hashing is the same for both queues).
    const cpu0 = process.cpuUsage();
    const main0 = threadCpuSeconds(process.pid, process.pid);
    let progress: { state: string; done: number; total: number; summary: { stored: number; failed: number } };
    for (;;) {
      progress = (await (await fetch(`${origin}/api/jobs/${receipt.jobId}`, { headers })).json()) as typeof progress;
      if (['done', 'failed', 'cancelled'].includes(progress.state)) break;
      await new Promise((r) => setTimeout(r, 250));
    }
    const seconds = (performance.now() - start) / 1000;
    const cpu = process.cpuUsage(cpu0);
    const mainMs = (threadCpuSeconds(process.pid, process.pid) - main0) * 1000;
    return {
      uploadSeconds: round(uploadSeconds, 2),
      seconds: round(seconds, 2),
      spectraPerSecond: round(count / seconds, 1),
      stored: progress.summary.stored,
      failed: progress.summary.failed,
      state: progress.state,
      serverCpuMsPerSpectrum: round((cpu.user + cpu.system) / 1000 / count, 2),
      serverMainThreadMsPerSpectrum: round(mainMs / count, 2),
    };
  } finally {
    await server.close();
    rmSync(dataDir, { recursive: true, force: true });
  }
}

const round = (x: number, digits: number) => Number(x.toFixed(digits));
const mean = (v: number[]) => (v.length ? v.reduce((a, b) => a + b, 0) / v.length : NaN);

/** CPU seconds a process has used so far (Linux /proc; utime + stime in clock ticks of 1/100 s). */
function processCpuSeconds(pid: number): number {
  return cpuOfStat(readFileSync(`/proc/${pid}/stat`, 'utf8'));
}

/** The same for one thread of a process (the main thread's id is the process id). */
function threadCpuSeconds(pid: number, tid: number): number {
  return cpuOfStat(readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8'));
}

function cpuOfStat(stat: string): number {
  const fields = stat.split(') ')[1]!.split(' ');
  return (Number(fields[11]) + Number(fields[12])) / 100;
}

const runs: Run[] = [];
const embedded = values['redis-only'] ? null : await ingest({});
if (embedded) {
  runs.push({ queue: 'embedded', ...embedded });
  say(`embedded queue: upload + expand + store ${embedded.uploadSeconds} s; all scanned after ${embedded.seconds} s — ${embedded.spectraPerSecond} spectra/s on ${cores} cores`);
}

let redisFigures: Record<string, unknown> | null = null;
if (workerCount > 0) {
  const threadsPerWorker = Math.max(1, Math.floor(cores / workerCount));
  let redis: TestRedis | null = null;
  const children: ChildProcess[] = [];
  const lines: string[] = [];
  let redisCpu0 = 0;
  try {
    redis = await startRedis();
    const redisUrl = redis.url;
    const run = await ingest({ JOB_QUEUE: redisUrl }, async (server) => {
      const { token } = createWorkerToken(server.ctx, null, 'bench');
      const ready: Promise<void>[] = [];
      for (let i = 0; i < workerCount; i++) {
        const child = spawn(process.execPath, ['--import', 'tsx', 'backend/src/cli/run-jobs.ts'], {
          env: { ...process.env, JOB_QUEUE: redisUrl, REDWARD_SERVER_URL: `http://127.0.0.1:${server.port}`, REDWARD_WORKER_TOKEN: token, SCAN_THREADS: String(threadsPerWorker), LOG_LEVEL: 'silent' },
          stdio: ['ignore', 'pipe', 'inherit'],
        });
        children.push(child);
        let partial = '';
        ready.push(
          new Promise((resolve, reject) => {
            child.once('exit', (code) => reject(new Error(`worker process ${i + 1} stopped (exit ${code}) before it was ready`)));
            child.stdout!.on('data', (chunk: Buffer) => {
              const parts = (partial + chunk.toString('utf8')).split('\n');
              partial = parts.pop()!;
              for (const line of parts) {
                if (line.startsWith('Redward scan worker')) resolve();
                lines.push(line);
              }
            });
          }),
        );
      }
      // Workers are up (and idle) before the clock starts, as on a cluster that is already running.
      await Promise.all(ready);
      redisCpu0 = processCpuSeconds(redis!.process.pid!);
    });
    const redisCpuMs = (processCpuSeconds(redis.process.pid!) - redisCpu0) * 1000;
    const timings = lines
      .map((l) => /\[fetch ([\d.]+) ms, scan ([\d.]+) ms, post ([\d.]+) ms\]/.exec(l))
      .filter((m): m is RegExpExecArray => m !== null)
      .map((m) => ({ fetch: Number(m[1]), scan: Number(m[2]), post: Number(m[3]) }));
    runs.push({ queue: 'redis', ...run });
    const fetchMs = mean(timings.map((t) => t.fetch));
    const scanMs = mean(timings.map((t) => t.scan));
    const postMs = mean(timings.map((t) => t.post));
    const threads = workerCount * threadsPerWorker;
    // Time a scan thread spends per item besides scanning: the BullMQ round trip (take the item,
    // report it done, lock renewals) and the two HTTP calls. Measured from the wall clock: each
    // thread handled count/threads items in `seconds`.
    const perItemThreadMs = (run.seconds * 1000 * threads) / count;
    const overheadMs = perItemThreadMs - scanMs;
    redisFigures = {
      workers: workerCount,
      threadsPerWorker,
      itemsTimed: timings.length,
      fetchMs: round(fetchMs, 1),
      scanMs: round(scanMs, 1),
      postMs: round(postMs, 1),
      perItemThreadMs: round(perItemThreadMs, 1),
      overheadMsPerItem: round(overheadMs, 1),
      redisCpuMsPerSpectrum: round(redisCpuMs / count, 3),
    };
    say(
      `redis queue (${workerCount} worker processes × ${threadsPerWorker} thread${threadsPerWorker > 1 ? 's' : ''}): upload + expand + store ${run.uploadSeconds} s; all scanned after ${run.seconds} s — ${run.spectraPerSecond} spectra/s`,
    );
    say(
      `  per item: scan ${scanMs.toFixed(1)} ms, fetch ${fetchMs.toFixed(1)} ms, post ${postMs.toFixed(1)} ms; thread time per item ${perItemThreadMs.toFixed(1)} ms → overhead ${overheadMs.toFixed(1)} ms beside the scan`,
    );
    say(
      `  server main thread CPU ${run.serverMainThreadMsPerSpectrum} ms per spectrum (process CPU ${run.serverCpuMsPerSpectrum} ms; embedded: ${embedded?.serverCpuMsPerSpectrum ?? '–'} ms including its scans); redis-server CPU ${(redisCpuMs / count).toFixed(3)} ms per spectrum`,
    );
    const capacity = 1000 / run.serverMainThreadMsPerSpectrum;
    const perThread = 1000 / perItemThreadMs;
    for (const n of [10, 100]) {
      const rate = Math.min(n * perThread, capacity);
      say(`  estimate for 10^6 spectra on ${n} worker threads like these: ${(1e6 / rate / 3600).toFixed(1)} h (${rate.toFixed(0)} spectra/s; the server records at most ≈ ${capacity.toFixed(0)}/s)`);
    }
  } finally {
    for (const c of children) c.kill('SIGTERM');
    await Promise.all(children.map((c) => (c.exitCode === null ? new Promise((r) => c.once('exit', r)) : null)));
    await redis?.stop();
  }
}

console.log(JSON.stringify({ spectra: count, pixels: 4000, zipMegabytes: round(archive.length / 1024 / 1024, 1), cores, runs, redis: redisFigures }));
