import { Piscina } from 'piscina';
import type { FuzzCase, FuzzCaseOutcome } from './fuzz-worker';
import { mutateSpectrum, seededRandom, type MutationKind } from './mutate-spectrum';

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
  const rnd = seededRandom(options.seed);
  let next = 0;
  const runOne = async (index: number) => {
    const source = options.corpus[Math.floor(rnd() * options.corpus.length)]!;
    const mutation = mutateSpectrum(source.bytes, rnd);
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
      if (report.failures.length < 50) report.failures.push({ case: index, file: source.name, mutation: `${mutation.kind}: ${mutation.detail}`, outcome: text });
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
  // Mutations are drawn in case order from one generator, so the same seed gives the same cases
  // whatever the thread count; only the drawing is sequential, the scans run in parallel.
  const lane = async () => {
    while (next < options.cases) await runOne(next++);
  };
  try {
    await Promise.all(Array.from({ length: options.threads }, lane));
  } finally {
    await pool.destroy();
  }
  report.seconds = (Date.now() - started) / 1000;
  return report;
}
