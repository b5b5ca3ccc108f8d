import { mkdtempSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { loadConfig } from '../../backend/src/config';
import { startServer } from '../../backend/src/server';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';

/**
 * `npm run bench:ingest -- [--spectra 2000] [--json]`: wall time from the start of one HTTP upload
 * of a zip of generated 4,000-pixel spectra to the moment every spectrum is stored and scanned,
 * on this machine's cores. Prints a table, then the figures as JSON on the last line.
 */
const { values } = parseArgs({ options: { spectra: { type: 'string', default: '2000' }, json: { type: 'boolean', default: false } } });
const count = Number(values.spectra);

const dataDir = mkdtempSync(path.join(tmpdir(), 'redward-bench-'));
const genStart = performance.now();
const archive = zip(syntheticSpectrumFiles(count, { pixels: 4000, prefix: 'BENCH' }));
const genSeconds = (performance.now() - genStart) / 1000;

const server = await startServer(
  loadConfig({ DATA_DIR: dataDir, PORT: '0', HOST: '127.0.0.1', LOG_LEVEL: 'silent', MAIL_CATCHER_PORT: '0', REDWARD_DEMO_SPECTRA: '0', UPLOAD_MAX_TOTAL_MB: '4096', UPLOAD_MAX_FILE_MB: '4096' }),
);
try {
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
  let progress: { state: string; done: number; total: number; summary: { stored: number; failed: number } };
  for (;;) {
    progress = (await (await fetch(`${origin}/api/jobs/${receipt.jobId}`, { headers })).json()) as typeof progress;
    if (['done', 'failed', 'cancelled'].includes(progress.state)) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  const seconds = (performance.now() - start) / 1000;
  const result = {
    spectra: count,
    pixels: 4000,
    zipMegabytes: Number((archive.length / 1024 / 1024).toFixed(1)),
    cores: availableParallelism(),
    uploadSeconds: Number(uploadSeconds.toFixed(2)),
    seconds: Number(seconds.toFixed(2)),
    spectraPerSecond: Number((count / seconds).toFixed(1)),
    stored: progress.summary.stored,
    failed: progress.summary.failed,
    state: progress.state,
  };
  if (!values.json) {
    console.log(`generated ${count} spectra in ${genSeconds.toFixed(1)} s (${result.zipMegabytes} MB zip, not timed)`);
    console.log(`upload + expand + store: ${result.uploadSeconds} s; all scanned after ${result.seconds} s (${result.spectraPerSecond} spectra/s on ${result.cores} cores)`);
  }
  console.log(JSON.stringify(result));
} finally {
  await server.close();
  rmSync(dataDir, { recursive: true, force: true });
}
