import { createHash } from 'node:crypto';
import { UnrecoverableError } from 'bullmq';
import { workerItemStateSchema, type WorkerItemState } from '../../contracts/workers';
import { encodeWorkerResult } from '../worker-result-body';
import type { ScanTaskResult } from '../scan-worker';

const TIMEOUT_MS = 120_000;

/** The server refused this worker's engine version: the worker must be updated, not retried. */
export class EngineMismatchError extends UnrecoverableError {}

/**
 * A remote worker's two calls to the Redward server, with its worker token. Network errors and
 * 5xx answers throw plain errors (BullMQ retries the item with backoff); 4xx answers other than
 * "nothing to do" are the worker's own fault and throw UnrecoverableError (no retry).
 */
export class WorkerClient {
  constructor(
    private readonly serverUrl: string,
    private readonly token: string,
  ) {}

  private headers(extra: Record<string, string> = {}) {
    return { Authorization: `Bearer ${this.token}`, ...extra };
  }

  /** The item's file, checked against its digest; null when the item needs no scan any more (409). */
  async takeFile(itemId: number, sha256: string): Promise<Uint8Array | null> {
    const res = await fetch(`${this.serverUrl}/api/worker/items/${itemId}/file`, { headers: this.headers(), signal: AbortSignal.timeout(TIMEOUT_MS) });
    if (res.status === 409) return null;
    if (!res.ok) throw await failure(res, `fetching the file of item ${itemId}`);
    const bytes = new Uint8Array(await res.arrayBuffer());
    const digest = createHash('sha256').update(bytes).digest('hex');
    if (digest !== sha256) throw new Error(`The file of item ${itemId} arrived damaged (sha-256 ${digest.slice(0, 12)}…, expected ${sha256.slice(0, 12)}…).`);
    return bytes;
  }

  /** Posts a result; a repeat of an already recorded item answers `applied: false`. Null when the job is closed. */
  async postResult(itemId: number, result: ScanTaskResult): Promise<WorkerItemState | null> {
    const res = await fetch(`${this.serverUrl}/api/worker/items/${itemId}/result`, {
      method: 'POST',
      headers: this.headers({ 'Content-Type': 'application/octet-stream' }),
      body: new Blob([new Uint8Array(encodeWorkerResult(result))]),
      signal: AbortSignal.timeout(TIMEOUT_MS),
    });
    if (!res.ok) {
      const err = await failure(res, `posting the result of item ${itemId}`);
      if (res.status === 409 && !(err instanceof EngineMismatchError)) return null;
      throw err;
    }
    return workerItemStateSchema.parse(await res.json());
  }
}

async function failure(res: Response, doing: string): Promise<Error> {
  const body = (await res.json().catch(() => null)) as { error?: { code?: string; message?: string } } | null;
  const message = `${doing}: ${res.status} ${body?.error?.code ?? ''} ${body?.error?.message ?? res.statusText}`.trim();
  if (body?.error?.code === 'engine_version_mismatch') return new EngineMismatchError(message);
  return res.status >= 500 || res.status === 429 ? new Error(message) : new UnrecoverableError(message);
}
