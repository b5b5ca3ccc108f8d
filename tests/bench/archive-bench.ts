import { execFileSync } from 'node:child_process';
import { createWriteStream, existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Zip, ZipDeflate } from 'fflate';
import { ArchiveRefusedError, expandArchive } from '../../backend/src/ingest/expand-archive';
import { BlobStore } from '../../backend/src/storage/blob-store';

// `npx tsx tests/bench/archive-bench.ts [--gib 3]`: how long a zip bomb (N GiB of zeros deflated
// to ≈ N MB, three entries) costs before it is refused, and the peak memory (max RSS) of the
// process that expands it under the default limits (ratio 200, 4 GiB, 512 MB per entry). The bomb
// is built once by streaming (never held in memory) and cached in the temporary folder; each
// measurement runs in a child process so its max RSS is that of the expansion alone.
const MB = 1024 * 1024;
const limits = { maxEntries: 20_000, maxExpandedBytes: 4096 * MB, maxEntryBytes: 512 * MB, maxRatio: 200 };

if (process.argv[2] === '--measure') {
  const zipPath = process.argv[3]!;
  const dir = mkdtempSync(path.join(tmpdir(), 'redward-bomb-store-'));
  const store = new BlobStore(dir);
  const rss0 = process.resourceUsage().maxRSS;
  const t0 = performance.now();
  let outcome = 'accepted';
  try {
    await expandArchive(zipPath, 'bomb.zip', store, limits);
  } catch (e) {
    outcome = e instanceof ArchiveRefusedError ? `${e.code}: ${e.message}` : `error: ${(e as Error).message}`;
  }
  const seconds = (performance.now() - t0) / 1000;
  rmSync(dir, { recursive: true, force: true });
  console.log(JSON.stringify({ seconds: +seconds.toFixed(3), maxRssMB: Math.round(process.resourceUsage().maxRSS / 1024), rssBeforeMB: Math.round(rss0 / 1024), outcome }));
  process.exit(0);
}

const gib = Number(process.argv[process.argv.indexOf('--gib') + 1] || 3) || 3;
const zipPath = path.join(tmpdir(), `redward-bomb-${gib}gib.zip`);
if (!existsSync(zipPath)) await buildBomb(zipPath, gib);
const size = statSync(zipPath).size;
const runs = [1, 2, 3].map(() => JSON.parse(execFileSync(process.execPath, ['--import', 'tsx', new URL(import.meta.url).pathname, '--measure', zipPath], { encoding: 'utf8' })) as { seconds: number; maxRssMB: number; rssBeforeMB: number; outcome: string });
const median = <T,>(v: T[], key: (x: T) => number) => v.map(key).sort((a, b) => a - b)[v.length >> 1]!;
console.log(`zip bomb ${(size / MB).toFixed(1)} MB → ${gib} GiB: refused in ${median(runs, (r) => r.seconds)} s (median of 3), max RSS ${median(runs, (r) => r.maxRssMB)} MB (${runs[0]!.rssBeforeMB} MB before expanding)`);
console.log(`  ${runs[0]!.outcome}`);
console.log(JSON.stringify({ compressedMB: +(size / MB).toFixed(2), gib, seconds: median(runs, (r) => r.seconds), maxRssMB: median(runs, (r) => r.maxRssMB) }));

async function buildBomb(file: string, gib: number): Promise<void> {
  const out = createWriteStream(file);
  const done = new Promise<void>((resolve, reject) => {
    out.on('finish', resolve);
    out.on('error', reject);
  });
  const zip = new Zip((err, chunk, final) => {
    if (err) throw err;
    out.write(chunk);
    if (final) out.end();
  });
  const zeros = new Uint8Array(16 * MB);
  const entries = 3;
  for (let e = 0; e < entries; e++) {
    const entry = new ZipDeflate(`spectrum-${e + 1}.fits`, { level: 9 });
    zip.add(entry);
    const chunks = (gib * 1024) / entries / 16;
    for (let c = 0; c < chunks; c++) entry.push(zeros, c === chunks - 1);
  }
  zip.end();
  await done;
}
