import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { availableParallelism, tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import autocannon from 'autocannon';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';

/**
 * `npm run bench:load -- [--readers 50] [--rate 2] [--seconds 20] [--ingest 2000] [--json]`
 *
 * Many signed-in readers on the routes the inspection screen uses, while a large upload is being
 * scanned on the same server: the reader's queue, a spectrum's detail, its arrays (/data) and its
 * χ²(z) curves, plus the campaign's spectra list. Loopback only. The server runs as its own
 * process (as in production: the load generator must not share its event loop) on a throw-away
 * DATA_DIR with the demo campaigns; its CPU time is read from /proc at the end. Prints p50/p95/p99 latency, requests and
 * errors per route, then the figures as JSON on the last line.
 *
 * Each reader is one connection sending `--rate` requests a second (default 2: a reader opening a
 * spectrum every few seconds fetches its detail, arrays, curves and model, and the queue), so 50
 * readers offer ≈ 100 requests a second. `--rate 0` removes the limit: every connection sends its
 * next request as soon as the last is answered, a stress test whose latency is then simply
 * connections ÷ throughput. Targets (issue 13): p95 ≤ 50 ms
 * for detail and queue, ≤ 150 ms for data and curves, 0 errors.
 */
const { values } = parseArgs({
  options: {
    readers: { type: 'string', default: '50' },
    rate: { type: 'string', default: '2' },
    seconds: { type: 'string', default: '20' },
    ingest: { type: 'string', default: '2000' },
    json: { type: 'boolean', default: false },
  },
});
const readers = Number(values.readers);
const rate = Number(values.rate);
const seconds = Number(values.seconds);
const ingestCount = Number(values.ingest);

const dataDir = mkdtempSync(path.join(tmpdir(), 'redward-load-'));
const archive = ingestCount > 0 ? zip(syntheticSpectrumFiles(ingestCount, { pixels: 4000, prefix: 'LOAD' })) : null;

const port = await freePort();
const origin = `http://127.0.0.1:${port}`;
const root = fileURLToPath(new URL('../..', import.meta.url));
const server = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'backend/src/cli/api-server.ts')], {
  cwd: root,
  env: { ...process.env, DATA_DIR: dataDir, API_PORT: String(port), LOG_LEVEL: 'silent', MAIL_CATCHER_PORT: '0', UPLOAD_MAX_TOTAL_MB: '4096', UPLOAD_MAX_FILE_MB: '4096' },
  stdio: ['ignore', 'ignore', 'inherit'],
});
await waitForHealth();

async function signIn(email: string): Promise<string> {
  const res = await fetch(`${origin}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json', origin }, body: JSON.stringify({ email, password: 'redward-demo' }) });
  if (!res.ok) throw new Error(`sign-in of ${email} answered ${res.status}`);
  return res.headers.get('set-cookie')!.split(';')[0]!;
}

async function getJson<T>(url: string, cookie: string): Promise<T> {
  const res = await fetch(`${origin}${url}`, { headers: { cookie } });
  if (!res.ok) throw new Error(`${url} answered ${res.status}`);
  return (await res.json()) as T;
}

interface RouteFigures {
  route: string;
  requests: number;
  errors: number;
  non2xx: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
}

function percentile(sorted: number[], q: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;
}

try {
  const leadCookie = await signIn('lead@demo.test');
  // The demo's spectra are scanned by jobs that start with the server: wait for both campaigns.
  type Page = { rows: { id: number; scanState: string }[]; total: number };
  let demo!: Page;
  for (const campaign of [2, 1]) {
    for (;;) {
      demo = await getJson<Page>(`/api/campaigns/${campaign}/spectra?pageSize=200`, leadCookie);
      if (demo.rows.length > 0 && demo.rows.every((r) => r.scanState === 'scanned')) break;
      await new Promise((r) => setTimeout(r, 250));
    }
  }
  const spectrumIds = demo.rows.map((r) => r.id);

  // One session per simulated reader, alternating between the two demo readers.
  const cookies: string[] = [];
  for (let i = 0; i < readers; i++) cookies.push(await signIn(i % 2 === 0 ? 'reader1@demo.test' : 'reader2@demo.test'));

  let ingest: Promise<{ seconds: number; state: string; stored: number }> | null = null;
  if (archive) {
    const form = new FormData();
    form.append('files', new Blob([new Uint8Array(archive)]), 'load.zip');
    const started = performance.now();
    const upload = await fetch(`${origin}/api/campaigns/1/uploads`, { method: 'POST', headers: { cookie: leadCookie, origin }, body: form });
    if (!upload.ok) throw new Error(`upload answered ${upload.status}: ${await upload.text()}`);
    const { jobId } = (await upload.json()) as { jobId: number };
    ingest = (async () => {
      for (;;) {
        const p = await getJson<{ state: string; summary: { stored: number } }>(`/api/jobs/${jobId}`, leadCookie);
        if (['done', 'failed', 'cancelled'].includes(p.state)) return { seconds: (performance.now() - started) / 1000, state: p.state, stored: p.summary.stored };
        await new Promise((r) => setTimeout(r, 500));
      }
    })();
  }

  const routes: { name: string; path: () => string }[] = [
    { name: 'queue', path: () => '/api/me/queue?campaign=1' },
    { name: 'detail', path: () => `/api/spectra/${pick(spectrumIds)}` },
    { name: 'data', path: () => `/api/spectra/${pick(spectrumIds)}/data` },
    { name: 'curves', path: () => `/api/spectra/${pick(spectrumIds)}/scan-curves` },
    { name: 'spectra list', path: () => '/api/campaigns/1/spectra?pageSize=50' },
  ];
  // Connections are shared out over the routes; each connection keeps one reader's session.
  const perRoute = Math.max(1, Math.floor(readers / routes.length));
  const runs = routes.map((route, r) => {
    const latencies: number[] = [];
    const cookie = cookies.slice(r * perRoute, (r + 1) * perRoute);
    let next = 0;
    return new Promise<RouteFigures>((resolve, reject) => {
      const instance = autocannon(
        {
          url: origin,
          connections: perRoute,
          duration: seconds,
          ...(rate > 0 ? { connectionRate: rate } : {}),
          requests: [{ setupRequest: (req) => ({ ...req, method: 'GET', path: route.path(), headers: { cookie: cookie[next++ % cookie.length]! } }) }],
        },
        (err, result) => {
          if (err) return reject(err);
          latencies.sort((a, b) => a - b);
          resolve({
            route: route.name,
            requests: latencies.length,
            errors: result.errors + result.timeouts,
            non2xx: result.non2xx,
            p50: round(percentile(latencies, 0.5)),
            p95: round(percentile(latencies, 0.95)),
            p99: round(percentile(latencies, 0.99)),
            max: round(latencies.at(-1) ?? Number.NaN),
          });
        },
      );
      instance.on('response', (_client, _status, _bytes, responseTime) => latencies.push(responseTime));
    });
  });
  const cpuBefore = serverCpuMs();
  const mainBefore = serverCpuMs('main');
  const figures = await Promise.all(runs);
  const serverCpu = serverCpuMs() - cpuBefore;
  const mainCpu = serverCpuMs('main') - mainBefore;
  const requestsServed = figures.reduce((sum, f) => sum + f.requests, 0);
  const ingestResult = ingest ? await ingest : null;

  if (!values.json) {
    console.log(`${readers} readers at ${rate > 0 ? `${rate} requests/s each` : 'no rate limit'} for ${seconds} s on ${availableParallelism()} cores, ${ingestCount}-spectrum upload being scanned meanwhile`);
    console.log('route          requests  errors  non-2xx   p50 ms   p95 ms   p99 ms   max ms');
    for (const f of figures) {
      console.log(
        `${f.route.padEnd(14)} ${String(f.requests).padStart(8)} ${String(f.errors).padStart(7)} ${String(f.non2xx).padStart(8)} ${f.p50.toFixed(1).padStart(8)} ${f.p95.toFixed(1).padStart(8)} ${f.p99.toFixed(1).padStart(8)} ${f.max.toFixed(1).padStart(8)}`,
      );
    }
    console.log(`server process CPU during the load: ${(serverCpu / 1000).toFixed(1)} s (all its threads, scans included) for ${requestsServed} requests; its web (main) thread ${(mainCpu / 1000).toFixed(1)} s = ${(mainCpu / requestsServed).toFixed(2)} ms a request, ingest work on that thread included`);
    if (ingestResult) console.log(`ingest: ${ingestResult.stored} stored, ${ingestResult.state} after ${ingestResult.seconds.toFixed(1)} s`);
  }
  console.log(JSON.stringify({ readers, rate, seconds, cores: availableParallelism(), ingest: ingestResult, serverCpuSeconds: Number((serverCpu / 1000).toFixed(1)), mainThreadCpuMsPerRequest: Number((mainCpu / requestsServed).toFixed(2)), routes: figures }));
} finally {
  server.kill('SIGTERM');
  await new Promise((r) => server.once('exit', r));
  rmSync(dataDir, { recursive: true, force: true });
}

/** CPU time of the server process so far, all threads (proc(5): utime + stime, in clock ticks of 10 ms). */
function serverCpuMs(thread?: 'main'): number {
  const stat = thread === 'main' ? `/proc/${server.pid}/task/${server.pid}/stat` : `/proc/${server.pid}/stat`;
  const fields = readFileSync(stat, 'utf8').split(') ')[1]!.split(' ');
  return (Number(fields[11]) + Number(fields[12])) * 10;
}

async function freePort(): Promise<number> {
  const probe = createServer();
  await new Promise<void>((r) => probe.listen(0, '127.0.0.1', r));
  const { port: free } = probe.address() as { port: number };
  await new Promise((r) => probe.close(r));
  return free;
}

async function waitForHealth(): Promise<void> {
  for (let i = 0; i < 600; i++) {
    if (server.exitCode !== null) throw new Error(`the server exited with ${server.exitCode} before answering`);
    try {
      if ((await fetch(`${origin}/api/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the server did not answer /api/health within 120 s');
}

function pick<T>(items: T[]): T {
  return items[Math.floor(Math.random() * items.length)]!;
}

function round(ms: number): number {
  return Number(ms.toFixed(1));
}
