import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../../../', import.meta.url));
const dist = path.join(root, 'frontend/dist');
const stampFile = path.join(dist, '.source-hash');

// Everything the bundle is made from: when any of it changes, the build is stale.
const SOURCES = ['frontend/src', 'frontend/index.html', 'frontend/public', 'backend/src/contracts', 'vite.config.ts', 'package-lock.json'];

function listFiles(p: string): string[] {
  if (!existsSync(p)) return [];
  if (!statSync(p).isDirectory()) return [p];
  return readdirSync(p, { withFileTypes: true })
    .sort((a, b) => a.name.localeCompare(b.name))
    .flatMap((entry) => listFiles(path.join(p, entry.name)));
}

function sourceHash(): string {
  const hash = createHash('sha256');
  for (const file of SOURCES.flatMap((s) => listFiles(path.join(root, s)))) {
    hash.update(path.relative(root, file)).update('\0').update(readFileSync(file)).update('\0');
  }
  return hash.digest('hex');
}

/** Builds the UI with Vite when frontend/dist is missing or older than its sources. */
export async function buildFrontendIfStale(log: (line: string) => void = console.log): Promise<boolean> {
  const wanted = sourceHash();
  const current = existsSync(stampFile) ? readFileSync(stampFile, 'utf8').trim() : '';
  if (current === wanted && existsSync(path.join(dist, 'index.html'))) return false;
  log(current ? 'The user interface changed; rebuilding it…' : 'Building the user interface (first start)…');
  const { build } = await import('vite');
  // A caller's NODE_ENV (vitest sets "test") would otherwise select React's development build.
  const previous = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({ configFile: path.join(root, 'vite.config.ts'), mode: 'production', logLevel: 'warn' });
  } finally {
    if (previous === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = previous;
  }
  writeFileSync(stampFile, wanted + '\n');
  return true;
}
