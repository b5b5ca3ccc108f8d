import { Piscina } from 'piscina';
import { SpectrumReadError } from '../spectra/errors';
import type { DataTask, DataTaskResult } from './data-worker';

const workerFile = new URL('./data-worker.ts', import.meta.url).href;

/** The spectrum-data thread, as the services see it. */
export interface SpectrumDataThread {
  /** The packed arrays of a stored file; a file the readers refuse rejects with a SpectrumReadError. */
  pack(filePath: string): Promise<Buffer>;
  /** Resolves once the thread has started and loaded the readers. */
  warm(): Promise<void>;
  destroy(): Promise<void>;
}

/**
 * One thread that parses and packs stored files for `/data` answers the byte cache does not hold.
 * On the web thread a cold text file took tens of ms to parse (`readTextSpectrum` was the largest
 * item of the first seconds of issue 13's load benchmark), during which every other reader
 * waited. The thread is kept (minThreads 1) so that only the server's start pays for loading the
 * readers under tsx; piscina unreferences it when idle, so it never keeps a process alive.
 */
export function createSpectrumDataThread(): SpectrumDataThread {
  const pool = new Piscina({ filename: workerFile, minThreads: 1, maxThreads: 1, idleTimeout: Number.POSITIVE_INFINITY, execArgv: ['--import', 'tsx'] });
  return {
    async pack(filePath) {
      const result = (await pool.run({ kind: 'pack', filePath } satisfies DataTask)) as DataTaskResult;
      if (!(result instanceof Uint8Array)) throw new SpectrumReadError(result.code, result.message);
      return Buffer.from(result.buffer, result.byteOffset, result.byteLength);
    },
    async warm() {
      await pool.run({ kind: 'warm' } satisfies DataTask);
    },
    destroy: () => pool.destroy(),
  };
}
