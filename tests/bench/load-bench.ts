import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { availableParallelism, tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import autocannon from 'autocannon';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import type { ProbeReport } from './server-probe';

/**
 * `npm run bench:load -- [--readers 50] [--rate 2] [--seconds 20] [--ingest 2000] [--arrivals spread|aligned] [--upload during|before] [--steady-after 5] [--profile DIR] [--json]`
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
 * readers offer ≈ 100 requests a second.
 *
 * The server process also loads `server-probe.ts` (over an IPC channel; no route): it reports the
 * web thread's event-loop delay and each request's in-server time, so that time spent queued on
 * the client side is told from work in the server. A table of the first `--first-seconds` (8)
 * seconds shows per second and route the client's p95 and the in-server p95, with the event
 * loop's largest delay in that second: the cold start, where the whole-window tail comes from. `--rate 0` removes the limit: every connection sends its
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
    arrivals: { type: 'string', default: 'spread' },
    upload: { type: 'string', default: 'during' },
    /** Also print the figures without the first N seconds (the server's caches start cold). */
    'steady-after': { type: 'string', default: '5' },
    /** Seconds shown one by one at the start (per-second p95 per route, event-loop delay). */
    'first-seconds': { type: 'string', default: '8' },
    /** Write CPU profiles of the server's threads (node --cpu-prof) into this folder. */
    profile: { type: 'string' },
    json: { type: 'boolean', default: false },
  },
});
const readers = Number(values.readers);
const rate = Number(values.rate);
const seconds = Number(values.seconds);
const ingestCount = Number(values.ingest);
const arrivals = values.arrivals;
const uploadWhen = values.upload;
const steadyAfterMs = Number(values['steady-after']) * 1000;
const firstSeconds = Number(values['first-seconds']);
if (arrivals !== 'spread' && arrivals !== 'aligned') throw new Error('--arrivals is spread or aligned');
if (uploadWhen !== 'during' && uploadWhen !== 'before') throw new Error('--upload is during or before');

const dataDir = mkdtempSync(path.join(tmpdir(), 'redward-load-'));
const archive = ingestCount > 0 ? zip(syntheticSpectrumFiles(ingestCount, { pixels: 4000, prefix: 'LOAD' })) : null;

const port = await freePort();
const origin = `http://127.0.0.1:${port}`;
const root = fileURLToPath(new URL('../..', import.meta.url));
// The server has no SIGTERM handler of its own; a profile is only written when it exits normally.
const profileArgs = values.profile
  ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(values.profile)}`, '--import', "data:text/javascript,process.once('SIGTERM',()=>process.exit(0))"]
  : [];
const probe = path.join(root, 'tests/bench/server-probe.ts');
const server = spawn(process.execPath, [...profileArgs, '--import', 'tsx', '--import', probe, path.join(root, 'backend/src/cli/api-server.ts')], {
  cwd: root,
  env: { ...process.env, DATA_DIR: dataDir, API_PORT: String(port), LOG_LEVEL: 'silent', MAIL_CATCHER_PORT: '0', UPLOAD_MAX_TOTAL_MB: '4096', UPLOAD_MAX_FILE_MB: '4096' },
  stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
});
const probeReport = () =>
  new Promise<ProbeReport>((resolve) => {
    server.once('message', (m) => resolve(m as ProbeReport));
    server.send({ probe: 'report' });
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
  /** In-server time (server-probe.ts: from the request reaching the app to its last byte), ms. */
  inServerP50: number;
  inServerP95: number;
  /** p95 of the requests answered after the first --steady-after seconds. */
  steadyP95: number;
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

  let ingest: Promise<{ seconds: number; uploadSeconds: number; state: string; stored: number }> | null = null;
  if (archive) {
    const form = new FormData();
    form.append('files', new Blob([new Uint8Array(archive)]), 'load.zip');
    const started = performance.now();
    // The upload itself (receiving, expanding and storing the archive) is part of the ingest the
    // readers share the server with: by default it is sent as they start, not before.
    const uploaded = (async () => {
      const upload = await fetch(`${origin}/api/campaigns/1/uploads`, { method: 'POST', headers: { cookie: leadCookie, origin }, body: form });
      if (!upload.ok) throw new Error(`upload answered ${upload.status}: ${await upload.text()}`);
      return { ...((await upload.json()) as { jobId: number }), uploadSeconds: (performance.now() - started) / 1000 };
    })();
    if (uploadWhen === 'before') await uploaded;
    ingest = (async () => {
      const { jobId, uploadSeconds } = await uploaded;
      for (;;) {
        const p = await getJson<{ state: string; summary: { stored: number } }>(`/api/jobs/${jobId}`, leadCookie);
        if (['done', 'failed', 'cancelled'].includes(p.state)) return { seconds: (performance.now() - started) / 1000, uploadSeconds, state: p.state, stored: p.summary.stored };
        await new Promise((r) => setTimeout(r, 500));
      }
    })();
    // Awaited after the load; a failed upload must not end the process as an unhandled rejection first.
    ingest.catch(() => undefined);
  }

  const routes: { name: string; path: () => string }[] = [
    { name: 'queue', path: () => '/api/me/queue?campaign=1' },
    { name: 'detail', path: () => `/api/spectra/${pick(spectrumIds)}` },
    { name: 'data', path: () => `/api/spectra/${pick(spectrumIds)}/data` },
    { name: 'curves', path: () => `/api/spectra/${pick(spectrumIds)}/scan-curves` },
    { name: 'spectra list', path: () => '/api/campaigns/1/spectra?pageSize=50' },
  ];
  // Connections are shared out over the routes; each connection keeps one reader's session.
  // autocannon's rate limit restarts every connection's allowance on a 1 s timer started when the
  // connection is made, and each connection then sends its `rate` requests back to back. With all
  // connections of one instance made at once (--arrivals aligned, as this bench did until
  // 2026-12-04), every reader fires in the same few milliseconds of each second: 100 requests
  // arrive together and the last waits for the other 99, whatever the server's speed. Readers
  // are independent people, so by default (--arrivals spread) each reader is its own one-connection
  // instance started at its own phase, i / readers of a second: the same offered rate, spread out.
  const perRoute = Math.max(1, Math.floor(readers / routes.length));
  const loadStarted = performance.now();
  server.send({ probe: 'start' });
  /** Client latencies by route and by the whole second (since the start) in which each request was sent. */
  const firstSecondsByRoute = routes.map(() => Array.from({ length: firstSeconds }, () => [] as number[]));
  const runs = routes.map((route, r) => {
    const latencies: number[] = [];
    const steady: number[] = [];
    const cookie = cookies.slice(r * perRoute, (r + 1) * perRoute);
    const drive = (connections: number, cookieAt: (n: number) => string, delayMs: number) =>
      new Promise<{ errors: number; non2xx: number }>((resolve, reject) => {
        setTimeout(() => {
          let next = 0;
          const instance = autocannon(
            {
              url: origin,
              connections,
              duration: seconds,
              ...(rate > 0 ? { connectionRate: rate } : {}),
              requests: [{ setupRequest: (req) => ({ ...req, method: 'GET', path: route.path(), headers: { cookie: cookieAt(next++) } }) }],
            },
            (err, result) => (err ? reject(err) : resolve({ errors: result.errors + result.timeouts, non2xx: result.non2xx })),
          );
          instance.on('response', (_client, _status, _bytes, responseTime) => {
            latencies.push(responseTime);
            const sentInSecond = Math.floor((performance.now() - responseTime - loadStarted) / 1000);
            if (sentInSecond >= 0 && sentInSecond < firstSeconds) firstSecondsByRoute[r]![sentInSecond]!.push(responseTime);
            if (performance.now() - loadStarted >= steadyAfterMs) steady.push(responseTime);
          });
        }, delayMs);
      });
    const instances =
      arrivals === 'aligned'
        ? [drive(perRoute, (n) => cookie[n % cookie.length]!, 0)]
        : cookie.map((c, i) => drive(1, () => c, rate > 0 ? (((r * perRoute + i) / (perRoute * routes.length)) * 1000) : 0));
    return Promise.all(instances).then((results): RouteFigures => {
      latencies.sort((a, b) => a - b);
      steady.sort((a, b) => a - b);
      return {
        route: route.name,
        inServerP50: Number.NaN,
        inServerP95: Number.NaN,
        steadyP95: round(percentile(steady, 0.95)),
        requests: latencies.length,
        errors: results.reduce((sum, x) => sum + x.errors, 0),
        non2xx: results.reduce((sum, x) => sum + x.non2xx, 0),
        p50: round(percentile(latencies, 0.5)),
        p95: round(percentile(latencies, 0.95)),
        p99: round(percentile(latencies, 0.99)),
        max: round(latencies.at(-1) ?? Number.NaN),
      };
    });
  });
  const cpuBefore = serverCpuMs();
  const mainBefore = serverCpuMs('main');
  const figures = await Promise.all(runs);
  const serverCpu = serverCpuMs() - cpuBefore;
  const mainCpu = serverCpuMs('main') - mainBefore;
  const requestsServed = figures.reduce((sum, f) => sum + f.requests, 0);
  const report = await probeReport();
  const inServer = routes.map(() => [] as number[]);
  const inServerFirst = routes.map(() => Array.from({ length: firstSeconds }, () => [] as number[]));
  for (const req of report.requests) {
    const r = routeOfPath(req.path);
    if (r < 0) continue;
    inServer[r]!.push(req.ms);
    const second = Math.floor(req.atMs / 1000);
    if (second < firstSeconds) inServerFirst[r]![second]!.push(req.ms);
  }
  figures.forEach((f, r) => {
    const sorted = inServer[r]!.sort((a, b) => a - b);
    f.inServerP50 = round(percentile(sorted, 0.5));
    f.inServerP95 = round(percentile(sorted, 0.95));
  });
  const p95Of = (xs: number[]) => round(percentile([...xs].sort((a, b) => a - b), 0.95));
  const firstSecondsTable = Array.from({ length: firstSeconds }, (_, second) => ({
    second,
    routes: Object.fromEntries(routes.map((route, r) => [route.name, { p95: p95Of(firstSecondsByRoute[r]![second]!), inServerP95: p95Of(inServerFirst[r]![second]!), requests: firstSecondsByRoute[r]![second]!.length }])),
    loopDelayMaxMs: report.loopPerSecond[second]?.max ?? Number.NaN,
  }));
  const ingestResult = ingest ? await ingest : null;

  if (!values.json) {
    console.log(
      `${readers} readers at ${rate > 0 ? `${rate} requests/s each, arrivals ${arrivals}` : 'no rate limit'} for ${seconds} s on ${availableParallelism()} cores, ${ingestCount}-spectrum upload ${uploadWhen === 'during' ? 'sent as they start' : 'sent before they start'} and scanned meanwhile`,
    );
    console.log(`route          requests  errors  non-2xx   p50 ms   p95 ms   p99 ms   max ms   p95 after ${steadyAfterMs / 1000} s   in-server p50 / p95 ms`);
    for (const f of figures) {
      console.log(
        `${f.route.padEnd(14)} ${String(f.requests).padStart(8)} ${String(f.errors).padStart(7)} ${String(f.non2xx).padStart(8)} ${f.p50.toFixed(1).padStart(8)} ${f.p95.toFixed(1).padStart(8)} ${f.p99.toFixed(1).padStart(8)} ${f.max.toFixed(1).padStart(8)} ${f.steadyP95.toFixed(1).padStart(8)}        ${f.inServerP50.toFixed(1).padStart(6)} / ${f.inServerP95.toFixed(1)}`,
      );
    }
    console.log(`web thread event-loop delay over the run: p50 ${report.loop.p50} ms, p99 ${report.loop.p99} ms, max ${report.loop.max} ms (mean ${report.loop.mean} ms)`);
    console.log(`first ${firstSeconds} s, by the second a request was sent: p95 ms client / in-server, and the event loop's largest delay in that second`);
    console.log(`  s  ${routes.map((route) => route.name.padStart(15)).join('')}   loop max ms`);
    for (const row of firstSecondsTable) {
      const cells = routes.map((route) => {
        const c = row.routes[route.name]!;
        return `${c.p95.toFixed(0)} / ${c.inServerP95.toFixed(0)}`.padStart(15);
      });
      console.log(`${String(row.second).padStart(3)}  ${cells.join('')}   ${row.loopDelayMaxMs.toFixed(1).padStart(11)}`);
    }
    console.log(`server process CPU during the load: ${(serverCpu / 1000).toFixed(1)} s (all its threads, scans included) for ${requestsServed} requests; its web (main) thread ${(mainCpu / 1000).toFixed(1)} s = ${(mainCpu / requestsServed).toFixed(2)} ms a request, ingest work on that thread included`);
    if (ingestResult) console.log(`ingest: upload answered after ${ingestResult.uploadSeconds.toFixed(1)} s; ${ingestResult.stored} stored, ${ingestResult.state} after ${ingestResult.seconds.toFixed(1)} s`);
  }
  console.log(JSON.stringify({ readers, rate, arrivals, upload: uploadWhen, seconds, cores: availableParallelism(), ingest: ingestResult, serverCpuSeconds: Number((serverCpu / 1000).toFixed(1)), mainThreadCpuMsPerRequest: Number((mainCpu / requestsServed).toFixed(2)), eventLoopDelay: report.loop, firstSeconds: firstSecondsTable, routes: figures }));
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

/** The route (index in `routes`, in the same order) a request path belongs to; -1 for the bench's own requests. */
function routeOfPath(url: string): number {
  const p = url.split('?')[0]!;
  if (p === '/api/me/queue') return 0;
  if (/^\/api\/spectra\/\d+$/.test(p)) return 1;
  if (/^\/api\/spectra\/\d+\/data$/.test(p)) return 2;
  if (/^\/api\/spectra\/\d+\/scan-curves$/.test(p)) return 3;
  if (/^\/api\/campaigns\/\d+\/spectra$/.test(p)) return 4;
  return -1;
}

function pick<T>(items: T[]): T {
  return items[Math.floor(Math.random() * items.length)]!;
}

function round(ms: number): number {
  return Number(ms.toFixed(1));
}
