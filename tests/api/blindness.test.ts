import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signInDemoMembers, uploadAssignedSpectra, type Agent } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let spectrumId: number;
let reader2: Agent;
let lead: Agent;
// A value nothing else in the campaign could produce by chance.
const FIRST_Z = 3.141592;
const FIRST_NOTE = 'first-reader-secret-note';

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  [spectrumId] = (await uploadAssignedSpectra(t, 1, 'BLIND')) as [number];
  const members = await signInDemoMembers(t);
  reader2 = members.reader2;
  lead = members.lead;
  const saved = await members.reader1.post(`/api/spectra/${spectrumId}/readings`).send({ z: FIRST_Z, grade: 'likely', class: 'galaxy', lines: [], note: FIRST_NOTE });
  expect(saved.status).toBe(200);
}, 60_000);
afterAll(() => t.cleanup());

describe('blind second reading', () => {
  it('no GET route shows the first reading to the second reader before they have read', async () => {
    const doc = (await request(t.app).get('/api/openapi.json')).body as { paths: Record<string, Record<string, unknown>> };
    const fill: Record<string, string> = { id: '1', spectrumId: String(spectrumId), jobId: '1', rank: '1', mailId: '1', tokenId: '1', token: 'x', userId: '1', disagreementId: '1' };
    const urls = Object.entries(doc.paths)
      .filter(([, ops]) => 'get' in ops)
      .map(([path]) => path.replace(/\{(\w+)\}/g, (_, name: string) => fill[name] ?? '1'))
      .map((url) => (url === '/api/me/queue' ? `${url}?campaign=1` : url));
    expect(urls.length).toBeGreaterThan(20);
    const leaks: string[] = [];
    for (const url of urls) {
      const res = await reader2.get(url).buffer(true);
      const body = typeof res.text === 'string' && res.text.length > 0 ? res.text : JSON.stringify(res.body ?? '');
      if (body.includes(String(FIRST_Z)) || body.includes(FIRST_NOTE)) leaks.push(url);
    }
    expect(leaks).toEqual([]);
    // The check can fail: the lead, who may see both readings, does see it.
    expect(JSON.stringify((await lead.get(`/api/spectra/${spectrumId}`)).body)).toContain(FIRST_NOTE);
  });

  it('the spectra list tells a reader only whether they themselves have read a spectrum', async () => {
    const members = await signInDemoMembers(t);
    const doneFor = async (agent: Agent) => {
      const res = await agent.get('/api/campaigns/1/spectra?q=BLIND');
      expect(res.status).toBe(200);
      return (res.body.rows as { id: number; readingsDone: number; readingsAssigned: number }[]).find((r) => r.id === spectrumId)!;
    };
    // reader1 has read, reader2 not yet: reader2 must not learn that the first reading is in.
    expect(await doneFor(reader2)).toMatchObject({ readingsDone: 0, readingsAssigned: 2 });
    expect(await doneFor(members.reader1)).toMatchObject({ readingsDone: 1 });
    expect(await doneFor(lead)).toMatchObject({ readingsDone: 1 });

    const second = await reader2.post(`/api/spectra/${spectrumId}/readings`).send({ z: 0.5, grade: 'likely', class: 'galaxy', lines: [], note: '' });
    expect(second.status).toBe(200);
    expect(await doneFor(reader2)).toMatchObject({ readingsDone: 1 });
    expect(await doneFor(members.reader1)).toMatchObject({ readingsDone: 1 });
    expect(await doneFor(lead)).toMatchObject({ readingsDone: 2 });
    expect(await doneFor(members.observer)).toMatchObject({ readingsDone: 2 });
  });
});
