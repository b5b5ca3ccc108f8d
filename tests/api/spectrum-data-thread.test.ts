import { readFileSync, writeFileSync } from 'node:fs';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spectra } from '../../backend/src/db/schema';
import { readSpectrum } from '../../backend/src/spectra/readSpectrum';
import { packSpectrum } from '../../backend/src/storage/pack-spectrum';
import { signInDemoMembers, uploadAssignedSpectra, type Agent } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let reader1: Agent;
let ids: number[];

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  ids = await uploadAssignedSpectra(t, 3, 'DATATHREAD');
  reader1 = (await signInDemoMembers(t)).reader1;
}, 60_000);
afterAll(() => t.cleanup());

function collectBytes(r: import('superagent').Response, done: (err: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  r.on('data', (c: Buffer) => chunks.push(c));
  r.on('end', () => done(null, Buffer.concat(chunks)));
}
const storedPath = (id: number) => t.ctx.store.pathOf(t.ctx.db.select({ sha256: spectra.sha256 }).from(spectra).where(eq(spectra.id, id)).get()!.sha256);

describe('/data answers packed on the spectrum-data thread', () => {
  it('sends exactly the packing of the stored file, also to requests that miss the cache together', async () => {
    const expected = packSpectrum(readSpectrum(readFileSync(storedPath(ids[0]!))));
    const answers = await Promise.all([1, 2, 3].map(() => reader1.get(`/api/spectra/${ids[0]}/data`).buffer(true).parse(collectBytes)));
    for (const res of answers) {
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('application/octet-stream');
      expect(Buffer.compare(res.body as Buffer, expected)).toBe(0);
    }
  });

  it('answers a stored file the readers now refuse with a clear 422, as JSON', async () => {
    // Damaged on disk after it was stored (the store never rewrites a file; a disk can).
    writeFileSync(storedPath(ids[1]!), 'wavelength,flux\nnot,numbers\n');
    const res = await reader1.get(`/api/spectra/${ids[1]}/data`);
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.body.error.code).toBe('spectrum_unreadable');
    expect(res.body.error.message).toMatch(/^night1\/DATATHREAD-0002\.csv can no longer be read: /);
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
    // The thread is still there for the next file.
    expect((await reader1.get(`/api/spectra/${ids[2]}/data`)).status).toBe(200);
  });
});
