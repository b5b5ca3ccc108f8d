import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import { createTestApp, waitForJob, type TestApp } from '../helpers/test-app';

let t: TestApp;
let lead: Awaited<ReturnType<TestApp['signIn']>>;

// Names built so that a wildcard read as a wildcard matches more than the name that holds it.
const NAMES = ['WILD-50%off.csv', 'WILD_under.csv', 'WILD-plain.csv', 'WILDxunder.csv', 'WILD-50xoff.csv'];

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  lead = await t.signIn('lead@demo.test');
  const generated = Object.values(syntheticSpectrumFiles(NAMES.length, { prefix: 'WILD' }));
  const files = Object.fromEntries(NAMES.map((name, i) => [`wild/${name}`, generated[i]!]));
  const up = await lead.post('/api/campaigns/1/uploads').attach('files', zip(files), 'wild.zip');
  expect(up.status).toBe(202);
  expect((await waitForJob(lead, up.body.jobId)).state).toBe('done');
}, 60_000);
afterAll(() => t.cleanup());

const search = async (q: string, extra = '') => {
  const res = await lead.get(`/api/campaigns/1/spectra?q=${encodeURIComponent(q)}&sort=fileName${extra}`);
  expect(res.status).toBe(200);
  return (res.body.rows as { fileName: string }[]).map((r) => r.fileName.split('/').pop());
};

describe('spectra list search', () => {
  it('finds all five by their common part', async () => {
    expect(await search('WILD')).toEqual(['WILD-50%off.csv', 'WILD-50xoff.csv', 'WILD-plain.csv', 'WILD_under.csv', 'WILDxunder.csv']);
  });

  it('takes % and _ in the search text literally, not as wildcards', async () => {
    expect(await search('%')).toEqual(['WILD-50%off.csv']);
    expect(await search('50%off')).toEqual(['WILD-50%off.csv']);
    expect(await search('_under')).toEqual(['WILD_under.csv']);
    expect(await search('\\')).toEqual([]);
  });

  it('gives the same answer when the same search shape comes again with other values and sorts', async () => {
    expect(await search('under', '&dir=desc')).toEqual(['WILDxunder.csv', 'WILD_under.csv']);
    expect(await search('plain', '&dir=desc')).toEqual(['WILD-plain.csv']);
    expect(await search('off', '&dir=asc&pageSize=1&page=2')).toEqual(['WILD-50xoff.csv']);
  });
});
