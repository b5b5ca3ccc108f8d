import { z } from 'zod';
import { workerResultSchema } from '../contracts/workers';
import { badRequest } from '../http/errors';
import { decodePackedCurves } from '../contracts/scan-curves-binary';
import type { ScanTaskResult } from './scan-worker';

/**
 * How a remote worker posts one scan result: `uint32 LE json length | JSON | packed χ² curves`.
 * The curves are already float32 bytes (jobs/scan-curves.ts, exactly what the database keeps), so
 * they travel as they are instead of as base64 text a third larger and a parse slower.
 */
export function encodeWorkerResult(result: ScanTaskResult): Buffer {
  const curves = result.ok && result.scanned.ok ? result.scanned.curves : new Uint8Array(0);
  const json = result.ok && result.scanned.ok ? { ...result, scanned: { ...result.scanned, curves: undefined } } : result;
  const text = Buffer.from(JSON.stringify(json), 'utf8');
  const head = Buffer.alloc(4);
  head.writeUInt32LE(text.length, 0);
  return Buffer.concat([head, text, curves]);
}

/** Reads a posted body back into a scan task result; anything malformed is a 400 naming the problem. */
export function decodeWorkerResult(body: unknown): ScanTaskResult {
  if (!Buffer.isBuffer(body) || body.length < 4) {
    throw badRequest('Send the result as application/octet-stream: a 4-byte length, the JSON result, then the packed curves.', 'result_malformed');
  }
  const jsonLength = body.readUInt32LE(0);
  if (jsonLength > body.length - 4) throw badRequest(`The result's JSON length (${jsonLength} bytes) runs past the body (${body.length} bytes).`, 'result_malformed');
  let json: unknown;
  try {
    json = JSON.parse(body.subarray(4, 4 + jsonLength).toString('utf8'));
  } catch (err) {
    throw badRequest(`The result's JSON does not parse: ${(err as Error).message}`, 'result_malformed');
  }
  const parsed = workerResultSchema.safeParse(json);
  if (!parsed.success) throw badRequest(`The result does not match what a scan answers:\n${z.prettifyError(parsed.error)}`, 'result_invalid');
  const curves = body.subarray(4 + jsonLength);
  // The validated JSON is kept as sent (not the schema's parse): the engine's answer is stored
  // exactly as an embedded runner stores it, with any field a newer engine adds.
  const result = json as ScanTaskResult;
  if (!result.ok || !result.scanned.ok) {
    if (curves.length > 0) throw badRequest('A result without a successful scan carries no curves.', 'result_malformed');
    return result;
  }
  checkCurves(curves);
  return { ...result, scanned: { ...result.scanned, curves: new Uint8Array(curves) } };
}

function checkCurves(curves: Buffer): void {
  let unpacked;
  try {
    unpacked = decodePackedCurves(curves);
  } catch (err) {
    throw badRequest(`The packed χ² curves do not read: ${(err as Error).message}`, 'result_malformed');
  }
  if (unpacked.length === 0) throw badRequest('A successful scan carries its χ² curves; none came.', 'result_malformed');
  const indexLength = curves.readUInt32LE(0);
  const header = 4 + indexLength + ((4 - ((4 + indexLength) % 4)) % 4);
  const expected = header + unpacked.reduce((sum, c) => sum + c.z.length * 8, 0);
  if (expected !== curves.length) throw badRequest(`The packed χ² curves hold ${curves.length} bytes where their index describes ${expected}.`, 'result_malformed');
}
