import { Piscina } from 'piscina';
import type { PhotoZColumns, FitOptions } from '../photoz/fitPhotoZ';
import type { ModelGrid } from '../photoz/modelGrid';
import type { PhotoZTask } from './photoz-worker';

const workerFile = new URL('./photoz-worker.ts', import.meta.url).href;

/** Copies a grid's model arrays (models, squares, the pairs' cross products) into SharedArrayBuffers, so every task shares them instead of copying ~4 MB. */
export function shareModelGrid(grid: ModelGrid): ModelGrid {
  const share = <T extends Float64Array | Uint8Array>(a: T): T => {
    const buf = new SharedArrayBuffer(a.byteLength);
    const out = new (a.constructor as new (b: SharedArrayBuffer) => T)(buf);
    out.set(a);
    return out;
  };
  return { ...grid, galaxy: share(grid.galaxy), galaxySquared: share(grid.galaxySquared), pairProduct: share(grid.pairProduct), star: share(grid.star), starExtrapolated: share(grid.starExtrapolated) };
}

/**
 * Fits a catalogue on `threads` worker threads in batches of `batch` sources; results come back
 * in input order as one set of columns.
 */
export async function fitCatalogueOnThreads(grid: ModelGrid, flux: Float64Array, err: Float64Array, n: number, threads: number, options: Partial<FitOptions> = {}, batch = 2000): Promise<PhotoZColumns> {
  const shared = shareModelGrid(grid);
  const nb = grid.bands.length;
  const pool = new Piscina({ filename: workerFile, minThreads: threads, maxThreads: threads, execArgv: ['--import', 'tsx'] });
  try {
    const parts: Array<Promise<PhotoZColumns>> = [];
    for (let start = 0; start < n; start += batch) {
      const m = Math.min(batch, n - start);
      const task: PhotoZTask = { grid: shared, flux: flux.slice(start * nb, (start + m) * nb), err: err.slice(start * nb, (start + m) * nb), n: m, options };
      parts.push(pool.run(task) as Promise<PhotoZColumns>);
    }
    const done = await Promise.all(parts);
    return concatColumns(done, n);
  } finally {
    await pool.destroy();
  }
}

function concatColumns(parts: PhotoZColumns[], n: number): PhotoZColumns {
  const out: PhotoZColumns = {
    z: new Float64Array(n), z68: new Float64Array(2 * n), z95: new Float64Array(2 * n), pLowZ: new Float64Array(n),
    starChi2: new Float64Array(n), galaxyChi2: new Float64Array(n), isStar: new Uint8Array(n),
    galaxyTemplate: new Int16Array(n), starTemplate: new Int16Array(n), bands: new Uint8Array(n),
  };
  let at = 0;
  for (const p of parts) {
    const m = p.z.length;
    for (const key of Object.keys(out) as Array<keyof PhotoZColumns>) {
      const width = key === 'z68' || key === 'z95' ? 2 : 1;
      (out[key] as Float64Array).set(p[key] as Float64Array, at * width);
    }
    at += m;
  }
  return out;
}
