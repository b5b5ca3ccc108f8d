import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * Issue 3: "The engine imports nothing from Express, Drizzle, fs or process.env". The computation
 * core may import only its own files, the line-list data and three pure packages; this reads every
 * source file of backend/src/spectra and checks its import specifiers and its use of process.
 */
const root = resolve(__dirname, '../../../backend/src/spectra');
const allowedPackages = new Set(['fft.js', 'fflate', 'papaparse']);

function sources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((d) => (d.isDirectory() ? sources(join(dir, d.name)) : d.name.endsWith('.ts') && !d.name.endsWith('.test.ts') ? [join(dir, d.name)] : []));
}

function specifiers(text: string): string[] {
  const out: string[] = [];
  for (const m of text.matchAll(/(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)|require\(\s*['"]([^'"]+)['"]\s*\)/g)) out.push((m[1] ?? m[2] ?? m[3])!);
  return out;
}

describe('the computation core stays pure', () => {
  const files = sources(root);

  it('has its files found (the check is not vacuous)', () => {
    expect(files.length).toBeGreaterThan(25);
    expect(files.some((f) => f.endsWith('scanSpectrum.ts'))).toBe(true);
  });

  it.each(sources(root).map((f) => [relative(root, f), f]))('%s imports only engine files, line lists and pure packages, and never reads process', (_name, file) => {
    const text = readFileSync(file, 'utf8');
    for (const spec of specifiers(text)) {
      if (spec.startsWith('.')) {
        const target = resolve(file, '..', spec);
        const inside = target.startsWith(root) || target.startsWith(resolve(root, '../../../line-lists'));
        expect(inside, `${spec} leaves the engine`).toBe(true);
      } else {
        expect(allowedPackages.has(spec), `${spec} is not one of ${[...allowedPackages].join(', ')}`).toBe(true);
      }
    }
    expect(/\bprocess\.(env|argv|cwd)/.test(text), 'uses process').toBe(false);
  });
});
