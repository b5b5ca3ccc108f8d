import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { parseFilterCurve } from '../photoz/filterCurve';
import { effectiveWavelength } from '../photoz/photometry';

/**
 * `npm run photoz:filters [-- --shared ../shared]`: copies the shared folder's filter curves into
 * line-lists/filters/<stem>.par + README.md (the product never reads the shared folder at run
 * time). Templates are not written: they are built in memory from our own recipes
 * (backend/src/photoz/analyticTemplates.ts), because the real spectra may not be shipped.
 * Deterministic: running it twice writes the same bytes.
 */
const repo = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..', '..');
const { values } = parseArgs({ options: { shared: { type: 'string', default: join(repo, '..', 'shared') } } });
const shared = resolve(values.shared!);

// ── Filters ──────────────────────────────────────────────────────────────────────────────────
const filterSrc = join(shared, 'filters');
const filterOut = join(repo, 'line-lists', 'filters');
mkdirSync(filterOut, { recursive: true });
const sharedReadme = readFileSync(join(filterSrc, 'README.md'), 'utf8');
const published = new Map<string, string>();
for (const line of sharedReadme.split('\n')) {
  const m = /\[`([^`]+)`\]\(\.\/[^)]+\)\|([^|]+)\|([^|]+)\|/.exec(line);
  if (m) published.set(m[1]!, `${m[2]!.trim()} | ${m[3]!.trim()}`);
}
const filterRows: string[] = [];
for (const file of readdirSync(filterSrc).filter((f) => f.endsWith('.par')).sort()) {
  const stem = basename(file, '.par');
  const text = readFileSync(join(filterSrc, file), 'utf8');
  const { text: shipped, note } = normaliseCurve(text, stem);
  const curve = parseFilterCurve(shipped, stem); // the shipped copy must pass our own parser
  writeFileSync(join(filterOut, file), shipped);
  const origin = text.split('\n').filter((l) => l.startsWith('#')).map((l) => l.replace(/^#\s*/, '').trim()).filter(Boolean).slice(0, 2).join(' — ').replace(/\|/g, '/');
  filterRows.push(`| \`${stem}\` | ${origin || '(no comment in file)'} | ${published.get(stem) ?? '— | —'} | ${(effectiveWavelength(curve) / 10).toFixed(1)} nm | ${note} |`);
}
writeFileSync(join(filterOut, 'README.md'), `# Filter transmission curves

Shipped with Redward for photometric redshifts; a catalogue column \`flux_<stem>\` / \`err_<stem>\`
names a filter by its file stem here. Copied by \`npm run photoz:filters\` from the project's
shared filter folder, which took them from the \`sedpy\` repository (bd-j/sedpy, MIT licence,
folder sedpy/data/filters, commit 1cfa0cbd4bf6e2bd3eb441634a829bf5f5c0af06); the curves come from
the instrument teams, as each file's own comment lines say.

Format (\`parseFilterCurve\`, backend/src/photoz/filterCurve.ts): \`#\` comments, then two columns:
vacuum wavelength in Å, strictly increasing, and transmission in [0, 1.5] (total throughput or
photon-to-electron efficiency: for AB magnitudes only the shape matters, because the
photon-counting band average normalises the curve).

Copies are byte for byte, except where the last column says otherwise: curves given in per cent are
divided by 100, and negative samples (scan noise around zero, never beyond 1 % of the peak) are
set to 0. Both changes are recorded in a comment line at the top of the copy.

λ_eff and Δλ_eff (published) are the values of sedpy's filter README as quoted by the shared
folder's README, with the definitions of Fukugita et al. (1996, AJ 111, 1748):
λ_eff = exp( ∫ T ln λ d(ln λ) / ∫ T d(ln λ) ); "ours" is the same integral over the shipped copy
(\`effectiveWavelength\`). tests/reference/photoz.test.ts checks every published value to 0.5 %.

| stem | origin (the file's first comment lines) | λ_eff published | Δλ_eff published | λ_eff ours | copy |
| --- | --- | --- | --- | --- | --- |
${filterRows.join('\n')}
`);

/** Per-cent curves → fractions; small negative samples → 0; everything else untouched. */
function normaliseCurve(text: string, stem: string): { text: string; note: string } {
  const percent = /transmission in %/i.test(text);
  let peak = 0;
  let negatives = 0;
  const lines = text.split('\n');
  for (const l of lines) {
    if (l.trimStart().startsWith('#') || l.trim() === '') continue;
    const t = Number(l.trim().split(/\s+/)[1]);
    if (t > peak) peak = t;
  }
  const out = lines.map((l) => {
    if (l.trimStart().startsWith('#') || l.trim() === '') return l;
    const [w, ts] = l.trim().split(/\s+/);
    let t = Number(ts);
    if (!percent && t >= 0) return l;
    if (t < 0) {
      if (-t > 0.01 * peak) throw new Error(`${stem}: transmission ${t} is below −1 % of the peak; refusing to clip it`);
      negatives++;
      t = 0;
    }
    return `${w} ${percent ? Number((t / 100).toPrecision(7)) : t}`;
  });
  const changes = [percent ? 'per cent divided by 100' : '', negatives ? `${negatives} negative sample${negatives > 1 ? 's' : ''} set to 0` : ''].filter(Boolean).join('; ');
  if (!changes) return { text, note: 'verbatim' };
  return { text: `# Redward copy: ${changes} (npm run photoz:filters).\n${out.join('\n')}`, note: changes };
}

console.log(`wrote ${filterRows.length} filter curves`);
