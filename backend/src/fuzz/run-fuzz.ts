import { Piscina } from 'piscina';
import type { FuzzCase, FuzzCaseOutcome } from './fuzz-worker';
import { mutateSpectrum, seededRandom, type Mutation, type MutationKind } from './mutate-spectrum';

export interface FuzzOptions {
  /** Real spectrum files to mutate: a name for the report and the bytes. */
  corpus: ReadonlyArray<{ name: string; bytes: Uint8Array }>;
  cases: number;
  seed: number;
  /** Wall-clock limit per case, ms: a case still running then counts as a hang. */
  timeLimitMs: number;
  threads: number;
  /** Called after each case (progress display). */
  onCase?: (done: number) => void;
}

export interface FuzzExample {
  case: number;
  file: string;
  mutation: string;
  outcome: string;
}

export interface FuzzReport {
  cases: number;
  cleanErrors: number;
  successes: number;
  crashes: number;
  hangs: number;
  nonFinite: number;
  /** Clean errors by SpectrumReadError code. */
  errorCodes: Record<string, number>;
  byMutation: Record<MutationKind, number>;
  /** Every crash, hang and non-finite result (first 50), enough to reproduce it. */
  failures: FuzzExample[];
  seconds: number;
}

const workerFile = new URL('./fuzz-worker.ts', import.meta.url).href;

export interface FuzzDraw {
  index: number;
  source: string;
  mutation: Mutation;
}

/**
 * The cases of a run in order: which corpus file and which mutation of it. Drawn from one seeded
 * generator, so case k of a seed is the same whatever the thread count (and can be written out
 * with `npm run fuzz -- --seed S --write-case k FILE` to reproduce a failure by hand).
 */
export function* fuzzCases(corpus: FuzzOptions['corpus'], seed: number): Generator<FuzzDraw, void, undefined> {
  const rnd = seededRandom(seed);
  for (let index = 0; ; index++) {
    const source = corpus[Math.floor(rnd() * corpus.length)]!;
    yield { index, source: source.name, mutation: mutateSpectrum(source.bytes, rnd) };
  }
}

/**
 * Mutates the corpus `cases` times (seeded, so a run can be repeated) and reads and scans every
 * variant in worker threads, each case under a wall-clock limit: a case that overruns is a hang
 * and its thread is destroyed (piscina abort) so the next case gets a fresh one.
 */
export async function runFuzz(options: FuzzOptions): Promise<FuzzReport> {
  const started = Date.now();
  const pool = new Piscina({ filename: workerFile, minThreads: options.threads, maxThreads: options.threads, execArgv: ['--import', 'tsx'] });
  const report: FuzzReport = {
    cases: 0,
    cleanErrors: 0,
    successes: 0,
    crashes: 0,
    hangs: 0,
    nonFinite: 0,
    errorCodes: {},
    byMutation: { truncate: 0, 'flip-bits': 0, 'duplicate-region': 0, 'absurd-header': 0, 'non-finite': 0, 'huge-size': 0, gzip: 0 },
    failures: [],
    seconds: 0,
  };
  const cases = fuzzCases(options.corpus, options.seed);
  let next = 0;
  const runOne = async () => {
    const draw = cases.next();
    if (draw.done) return;
    const { index, source, mutation } = draw.value;
    report.byMutation[mutation.kind] += 1;
    const controller = new AbortController();
    let hung = false;
    const timer = setTimeout(() => {
      hung = true;
      controller.abort();
    }, options.timeLimitMs);
    let outcome: FuzzCaseOutcome | 'hang';
    try {
      outcome = (await pool.run({ bytes: mutation.bytes } satisfies FuzzCase, { signal: controller.signal })) as FuzzCaseOutcome;
    } catch (err) {
      outcome = hung ? 'hang' : { kind: 'crash', error: `the worker died: ${(err as Error).message}` };
    } finally {
      clearTimeout(timer);
    }
    report.cases += 1;
    const fail = (text: string) => {
      if (report.failures.length < 50) report.failures.push({ case: index, file: source, mutation: `${mutation.kind}: ${mutation.detail}`, outcome: text });
    };
    if (outcome === 'hang') {
      report.hangs += 1;
      fail(`no answer within ${options.timeLimitMs / 1000} s`);
    } else if (outcome.kind === 'clean-error') {
      report.cleanErrors += 1;
      report.errorCodes[outcome.code] = (report.errorCodes[outcome.code] ?? 0) + 1;
    } else if (outcome.kind === 'success') report.successes += 1;
    else if (outcome.kind === 'non-finite') {
      report.nonFinite += 1;
      fail(`non-finite result: ${outcome.problem}`);
    } else {
      report.crashes += 1;
      fail(`crash: ${outcome.error}`);
    }
    options.onCase?.(report.cases);
  };
  // Cases are drawn in order (synchronously, before each await); only the scans run in parallel.
  const lane = async () => {
    while (next++ < options.cases) await runOne();
  };
  try {
    await Promise.all(Array.from({ length: options.threads }, lane));
  } finally {
    await pool.destroy();
  }
  report.seconds = (Date.now() - started) / 1000;
  return report;
}
