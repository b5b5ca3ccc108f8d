import { desc } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mailMessages } from '../../backend/src/db/schema';
import { uploadAssignedSpectra, userIdOf } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let ids: number[];

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  ids = await uploadAssignedSpectra(t, 5, 'ASG', false);
}, 60_000);
afterAll(() => t.cleanup());

describe('assignment by the lead', () => {
  it('gives every spectrum two different readers, balanced, and e-mails each reader', async () => {
    const lead = await t.signIn('lead@demo.test');
    const r1 = userIdOf(t, 'reader1@demo.test');
    const r2 = userIdOf(t, 'reader2@demo.test');
    const l = userIdOf(t, 'lead@demo.test');
    const res = await lead.post('/api/campaigns/1/assignments').send({ readerIds: [r1, r2, l] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.assigned).toBe(10);
    const loads = res.body.perReader.map((p: { first: number; second: number }) => p.first + p.second).sort();
    expect(loads).toEqual([3, 3, 4]);
    const mails = t.ctx.db.select().from(mailMessages).orderBy(desc(mailMessages.id)).limit(3).all();
    expect(mails.map((m) => m.toAddress).sort()).toEqual(['lead@demo.test', 'reader1@demo.test', 'reader2@demo.test']);
    expect(mails[0]!.subject).toMatch(/^\d spectra to read in Lantern Cluster arcs$/);
    expect(mails[0]!.textBody).toContain('http://redward.test/campaigns/1/inspect');
    const again = await lead.post('/api/campaigns/1/assignments').send({ readerIds: [r1, r2] });
    expect(again.body.assigned).toBe(0);
  });

  it('refuses observers as readers and needs two readers', async () => {
    const lead = await t.signIn('lead@demo.test');
    const obs = await lead.post('/api/campaigns/1/assignments').send({ readerIds: [userIdOf(t, 'reader1@demo.test'), userIdOf(t, 'observer@demo.test')] });
    expect(obs.status).toBe(400);
    expect(obs.body.error.code).toBe('not_a_reader');
    const one = await lead.post('/api/campaigns/1/assignments').send({ readerIds: [userIdOf(t, 'reader1@demo.test')] });
    expect(one.body.error.message).toBe('readerIds: Choose at least two readers.');
  });

  it('reassigns a reading not yet made, never to the person making the other reading', async () => {
    const lead = await t.signIn('lead@demo.test');
    const reader1 = await t.signIn('reader1@demo.test');
    const queue = (await reader1.get('/api/me/queue?campaign=1')).body as { id: number; readingOrder: 'first' | 'second' }[];
    const item = queue[0]!;
    const other = item.readingOrder === 'first' ? 'second' : 'first';
    const detail = (await lead.get(`/api/spectra/${item.id}`)).body;
    expect(detail.spectrum.id).toBe(item.id);
    const same = await lead.put(`/api/spectra/${item.id}/assignments`).send({ readingOrder: other, readerId: userIdOf(t, 'reader1@demo.test') });
    expect(same.status).toBe(409);
    expect(same.body.error.code).toBe('same_reader');
    await reader1.post(`/api/spectra/${item.id}/readings`).send({ z: 0.3, grade: 'likely', class: 'galaxy' });
    const done = await lead.put(`/api/spectra/${item.id}/assignments`).send({ readingOrder: item.readingOrder, readerId: userIdOf(t, 'reader2@demo.test') });
    expect(done.status).toBe(409);
    expect(done.body.error.code).toBe('already_read');
    const listed = (await lead.get(`/api/spectra/${item.id}/assignments`)).body;
    expect(listed.assignments.find((a: { readingOrder: string }) => a.readingOrder === item.readingOrder)).toMatchObject({ name: 'Rafael Demo (reader 1)', read: true });
    expect(listed.candidates.map((c: { role: string }) => c.role).sort()).toEqual(['lead', 'reader', 'reader']);
    expect((await reader1.get(`/api/spectra/${item.id}/assignments`)).status).toBe(403);
    const next = queue[1]!;
    const moved = await lead.put(`/api/spectra/${next.id}/assignments`).send({ readingOrder: next.readingOrder, readerId: userIdOf(t, 'observer@demo.test') });
    expect(moved.status).toBe(400);
    expect(ids.length).toBe(5);
  });
});
