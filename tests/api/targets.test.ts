import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { targets } from '../../backend/src/db/schema';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ JOB_RUNNER: '0' });
});
afterAll(() => t.cleanup());

const CATALOGUE = [
  '# Lantern Cluster arc candidates (invented)',
  'ID,RA,DEC,F160W,zphot,zphot_l68,zphot_u68,family,notes',
  'LNT-0001,10:42:03.50,-11:38:00.0,24.1,6.1,5.9,6.3,A,bright knot',
  'LNT-0002,160.5200,-11.6400,25.3,6.2,6.0,6.4,A,',
  'LNT-0003,160.5300,-11.6500,23.0,0.8,0.7,0.9,,interloper?',
].join('\n');

const upload = (agent: ReturnType<TestApp['agent']>, text: string, opts: { mapping?: object; dryRun?: boolean } = {}) => {
  let req = agent.post(`/api/campaigns/1/targets${opts.dryRun ? '?dryRun=1' : ''}`).attach('files', Buffer.from(text), 'targets.csv');
  if (opts.mapping) req = req.field('mapping', JSON.stringify(opts.mapping));
  return req;
};

describe('target catalogue import', () => {
  it('proposes a mapping from the column names in a dry run, storing nothing', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await upload(lead, CATALOGUE, { dryRun: true });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      dryRun: true,
      rows: 3,
      columns: ['ID', 'RA', 'DEC', 'F160W', 'zphot', 'zphot_l68', 'zphot_u68', 'family', 'notes'],
      mapping: { id: 'ID', ra: 'RA', dec: 'DEC', magnitude: 'F160W', photoZ: 'zphot', photoZLow: 'zphot_l68', photoZHigh: 'zphot_u68', imageFamily: 'family' },
      errors: [],
    });
    expect(t.ctx.db.select().from(targets).all()).toEqual([]);
  });

  it('imports with the mapping, converting sexagesimal coordinates and keeping unmapped columns', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await upload(lead, CATALOGUE);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ dryRun: false, created: 3, updated: 0 });
    const first = t.ctx.db.select().from(targets).where(eq(targets.catalogueId, 'LNT-0001')).get()!;
    expect(first.ra).toBeCloseTo(160.5145833, 6);
    expect(first.dec).toBeCloseTo(-11.6333333, 6);
    expect(first).toMatchObject({ magnitude: 24.1, photoZ: 6.1, photoZLow: 5.9, photoZHigh: 6.3, imageFamily: 'A', extra: { notes: 'bright knot' } });
  });

  it('updates targets by id on a second import', async () => {
    const lead = await t.signIn('lead@demo.test');
    const changed = CATALOGUE.replace('LNT-0003,160.5300,-11.6500,23.0,0.8,0.7,0.9', 'LNT-0003,160.5300,-11.6500,23.0,0.85,0.7,0.9');
    const res = await upload(lead, changed);
    expect(res.body).toMatchObject({ created: 0, updated: 3 });
    expect(t.ctx.db.select().from(targets).where(eq(targets.catalogueId, 'LNT-0003')).get()!.photoZ).toBe(0.85);
    expect(t.ctx.db.select().from(targets).all()).toHaveLength(3);
  });

  it('refuses a catalogue with bad rows, naming each line, and imports none of it', async () => {
    const lead = await t.signIn('lead@demo.test');
    const bad = ['id,ra,dec,zphot,zphot_l68,zphot_u68', 'NEW-1,10:42:03,-11:38:00,1.0,0.9,1.1', 'NEW-2,25:00:00,-11:38:00,1.0,0.9,1.1', 'NEW-1,160.1,-11.2,1.0,0.9,1.1', 'NEW-3,160.1,-11.2,2.0,0.9,1.1'].join('\n');
    const res = await upload(lead, bad);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('catalogue_invalid');
    expect(res.body.error.message).toMatch(/^3 problems in the catalogue \(first on line 3: .*\); nothing was imported\.$/);
    expect(res.body.error.details.errors).toEqual([
      { line: 3, column: 'ra', message: '"25:00:00" is not a right ascension (degrees 0–360 or hh:mm:ss).' },
      { line: 4, column: 'id', message: 'The id "NEW-1" already appears on line 2.' },
      { line: 5, column: 'zphot', message: 'The photometric redshift 2 lies outside its own 68 % range.' },
    ]);
    expect(t.ctx.db.select().from(targets).all()).toHaveLength(3);
  });

  it('asks for a mapping when no column looks like an id, and checks mapped columns exist', async () => {
    const lead = await t.signIn('lead@demo.test');
    const noId = await upload(lead, 'alpha,delta\n1,2\n');
    expect(noId.status).toBe(400);
    expect(noId.body.error.message).toMatch(/No column looks like a catalogue id/);
    const wrong = await upload(lead, 'alpha,delta\n1,2\n', { mapping: { id: 'name' } });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details.errors[0]).toEqual({ line: 1, column: 'name', message: 'The catalogue has no column "name" (mapped to id).' });
  });

  it('is for leads only', async () => {
    const reader = await t.signIn('reader1@demo.test');
    expect((await upload(reader, CATALOGUE)).status).toBe(403);
  });
});
