import { writeFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { loadCorpus, REAL_SPECTRA_DIR } from '../fuzz/load-corpus';
import { fuzzCases, runFuzz } from '../fuzz/run-fuzz';

// `npm run fuzz -- --cases N [--seed S] [--time-limit SECONDS] [--threads T] [--per-folder K] [--corpus DIR] [--json] [--write-case K FILE]`:
// mutates real spectra and counts clean errors, successes, crashes, hangs and non-finite results.
// A hang is a case still running after --time-limit (default 60 s, the scan worker's own default limit).
// Exit 1 when any case crashed, hung or gave a non-finite result; 2 on a usage error.
const args = process.argv.slice(2);
let cases = 1000;
let seed = 1;
let timeLimitS = 60;
let threads = Math.max(1, availableParallelism());
let perFolder = 2;
let corpusDir = REAL_SPECTRA_DIR;
let json = false;
let writeCase: { index: number; file: string } | undefined;
for (let i = 0; i < args.length; i++) {
  const a = args[i]!;
  const value = () => {
    const v = Number(args[++i]);
    if (!Number.isFinite(v) || v <= 0) usage(`${a} needs a positive number`);
    return v;
  };
  if (a === '--cases') cases = Math.floor(value());
  else if (a === '--seed') seed = Math.floor(value());
  else if (a === '--time-limit') timeLimitS = value();
  else if (a === '--threads') threads = Math.floor(value());
  else if (a === '--per-folder') perFolder = Math.floor(value());
  else if (a === '--corpus') corpusDir = args[++i] ?? usage('--corpus needs a folder');
  else if (a === '--json') json = true;
  else if (a === '--write-case') {
    const index = Number(args[++i]);
    const file = args[++i];
    if (!Number.isInteger(index) || index < 0 || !file) usage('--write-case needs a case number and a file');
    writeCase = { index, file };
  }
  else usage(`unknown option ${a}`);
}

const corpus = loadCorpus(corpusDir, perFolder);
if (corpus.length === 0) usage(`no readable spectra under ${corpusDir}`);
if (writeCase) {
  for (const c of fuzzCases(corpus, seed)) {
    if (c.index < writeCase.index) continue;
    writeFileSync(writeCase.file, c.mutation.bytes);
    console.log(`case ${c.index} of seed ${seed}: ${c.source} [${c.mutation.kind}: ${c.mutation.detail}] → ${writeCase.file}`);
    break;
  }
  process.exit(0);
}
if (!json) console.log(`Fuzzing ${cases} cases (seed ${seed}) from ${corpus.length} real spectra, ${threads} threads, ${timeLimitS} s per case…`);
const report = await runFuzz({
  corpus,
  cases,
  seed,
  timeLimitMs: timeLimitS * 1000,
  threads,
  onCase: (done) => {
    if (!json && process.stderr.isTTY && done % 100 === 0) process.stderr.write(`\r${done}/${cases}`);
  },
});
if (json) console.log(JSON.stringify(report));
else {
  if (process.stderr.isTTY) process.stderr.write('\r');
  console.log(`cases ${report.cases} in ${report.seconds.toFixed(1)} s`);
  console.log(`  clean errors      ${report.cleanErrors}`);
  console.log(`  successes         ${report.successes}`);
  console.log(`  crashes           ${report.crashes}`);
  console.log(`  hangs             ${report.hangs}`);
  console.log(`  non-finite        ${report.nonFinite}`);
  console.log(`  clean errors by code: ${Object.entries(report.errorCodes).sort((a, b) => b[1] - a[1]).map(([c, n]) => `${c} ${n}`).join(', ')}`);
  console.log(`  cases by mutation:    ${Object.entries(report.byMutation).map(([k, n]) => `${k} ${n}`).join(', ')}`);
  for (const f of report.failures) console.log(`  ! case ${f.case} ${f.file} [${f.mutation}] → ${f.outcome}`);
}
process.exitCode = report.crashes + report.hangs + report.nonFinite > 0 ? 1 : 0;

function usage(why: string): never {
  console.error(`Usage: npm run fuzz -- --cases N [--seed S] [--time-limit SECONDS] [--threads T] [--per-folder K] [--corpus DIR] [--json] [--write-case K FILE]  (${why})`);
  process.exit(2);
}
