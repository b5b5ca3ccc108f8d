import { describe, expect, it } from 'vitest';
import { loadCorpus, REAL_SPECTRA_DIR } from '../../../backend/src/fuzz/load-corpus';
import { mutateSpectrum, seededRandom } from '../../../backend/src/fuzz/mutate-spectrum';
import { fuzzCases, runFuzz } from '../../../backend/src/fuzz/run-fuzz';

const corpus = loadCorpus(REAL_SPECTRA_DIR, 1);

describe('mutations', () => {
  it('are reproducible from the seed and differ from the original', () => {
    const a = fuzzCases(corpus, 5);
    const b = fuzzCases(corpus, 5);
    for (let k = 0; k < 20; k++) {
      const x = a.next().value!;
      const y = b.next().value!;
      expect(x.source).toBe(y.source);
      expect(x.mutation.detail).toBe(y.mutation.detail);
      expect(Buffer.from(x.mutation.bytes).equals(Buffer.from(y.mutation.bytes))).toBe(true);
    }
    const original = corpus[0]!.bytes;
    const m = mutateSpectrum(original, seededRandom(1));
    expect(Buffer.from(m.bytes).equals(Buffer.from(original))).toBe(false);
  });
});

describe('a short fuzz run over the real spectra (the CI share of `npm run fuzz`)', () => {
  it('200 cases: no crash, no hang, no non-finite result', { timeout: 120_000 }, async () => {
    expect(corpus.length).toBeGreaterThanOrEqual(10);
    const report = await runFuzz({ corpus, cases: 200, seed: 20260, timeLimitMs: 30_000, threads: 2 });
    expect(report.failures).toEqual([]);
    expect(report).toMatchObject({ cases: 200, crashes: 0, hangs: 0, nonFinite: 0 });
    expect(report.cleanErrors + report.successes).toBe(200);
    // Both outcomes occur: the mutations are neither all harmless nor all fatal.
    expect(report.cleanErrors).toBeGreaterThan(20);
    expect(report.successes).toBeGreaterThan(20);
  });
});
