import { desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { confirmedRedshifts, mailMessages, memberships } from '../../backend/src/db/schema';
import { signInDemoMembers, uploadAssignedSpectra, userIdOf, type Agent } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let ids: number[];
let reader1: Agent;
let reader2: Agent;
let lead: Agent;
let observer: Agent;

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  ids = await uploadAssignedSpectra(t, 3, 'REL');
  ({ reader1, reader2, lead, observer } = await signInDemoMembers(t));
}, 60_000);
afterAll(() => t.cleanup());

describe('agreement', () => {
  it('confirms two agreeing readings automatically with the inverse-variance mean and the lower grade', async () => {
    const id = ids[0]!;
    const first = await reader1.post(`/api/spectra/${id}/readings`).send({ z: 1.0, zErr: 0.001, grade: 'sure', class: 'galaxy', lines: ['H-beta'] });
    expect(first.body).not.toHaveProperty('outcome');
    expect((await lead.get(`/api/spectra/${id}/confirmed`)).body.history).toEqual([]);
    const second = await reader2.post(`/api/spectra/${id}/readings`).send({ z: 1.002, zErr: 0.002, grade: 'likely', class: 'galaxy', lines: ['[O III] 5008'] });
    const history = (await observer.get(`/api/spectra/${id}/confirmed`)).body.history;
    expect(history).toHaveLength(1);
    // Each reading's error is the one sent widened by the resolution floor, (1 + z)·300.45 km/s / (2.355 c)
    // on these 150.2 km/s pixels: 8.512e-4 at z = 1, so σ₁ = √(0.001² + floor²) = 1.3132e-3.
    const e1 = first.body.reading.zErr;
    const e2 = second.body.reading.zErr;
    expect(first.body.reading.lineMeasurements.zErrFloor).toBeCloseTo(8.512e-4, 7);
    expect(e1).toBeCloseTo(1.3132e-3, 7);
    // The confirmed value is their inverse-variance mean (1.00053), σ = 1/√Σw (1.124e-3, above the floor).
    const [w1, w2] = [1 / e1 ** 2, 1 / e2 ** 2];
    expect(history[0]).toMatchObject({ method: 'agreement', grade: 'likely', class: 'galaxy', isCurrent: true, lines: ['H-beta', '[O III] 5008'] });
    expect(history[0].z).toBeCloseTo((w1 * 1.0 + w2 * 1.002) / (w1 + w2), 10);
    expect(history[0].z).toBeCloseTo(1.000535, 6);
    expect(history[0].zErr).toBeCloseTo(1 / Math.sqrt(w1 + w2), 10);
    expect(history[0].zErr).toBeCloseTo(1.12404e-3, 8);
    const locked = await reader1.post(`/api/spectra/${id}/readings`).send({ z: 1.1, grade: 'sure', class: 'galaxy' });
    expect(locked.status).toBe(409);
    expect(locked.body.error.code).toBe('reading_locked');
  });
});

describe('disagreement and settlement', () => {
  it('opens a disagreement, e-mails the lead, and lets only the lead see both readings', async () => {
    const id = ids[1]!;
    await reader1.post(`/api/spectra/${id}/readings`).send({ z: 0.5, grade: 'sure', class: 'galaxy', lines: ['H-alpha'] });
    await reader2.post(`/api/spectra/${id}/readings`).send({ z: 2.1, grade: 'sure', class: 'galaxy', lines: ['C III] 1909'] });
    const list = await lead.get('/api/campaigns/1/disagreements');
    expect(list.status).toBe(200);
    expect(list.body).toHaveLength(1);
    expect(list.body[0]).toMatchObject({ spectrumId: id, reasons: ['z'] });
    expect(list.body[0].readings.map((r: { z: number; readingOrder: string }) => [r.readingOrder, r.z])).toEqual([
      ['first', 0.5],
      ['second', 2.1],
    ]);
    // Readers see only disagreements a lead handed to them: none here.
    const forReader = await reader1.get('/api/campaigns/1/disagreements');
    expect(forReader.status).toBe(200);
    expect(forReader.body).toEqual([]);
    expect((await observer.get('/api/campaigns/1/disagreements')).status).toBe(403);
    const mail = t.ctx.db.select().from(mailMessages).orderBy(desc(mailMessages.id)).get()!;
    expect(mail.toAddress).toBe('lead@demo.test');
    expect(mail.subject).toMatch(/^Disagreement to settle in Lantern Cluster arcs: /);
    expect(mail.textBody).toContain('the redshifts differ beyond the tolerance');
    expect(mail.textBody).toContain('http://redward.test/campaigns/1/disagreements');
  });

  it('settles with a new value and a reason; the observer may look but not settle', async () => {
    const d = (await lead.get('/api/campaigns/1/disagreements')).body[0];
    const byObserver = await observer.post(`/api/disagreements/${d.id}/settle`).send({ choice: 'first', reason: 'looks right' });
    expect(byObserver.status).toBe(403);
    const noReason = await lead.post(`/api/disagreements/${d.id}/settle`).send({ choice: 'first' });
    expect(noReason.status).toBe(400);
    const settled = await lead.post(`/api/disagreements/${d.id}/settle`).send({ choice: 'new', z: 0.5003, grade: 'likely', class: 'galaxy', lines: ['H-alpha', '[N II] 6585'], reason: 'Hα + [N II] resolved; the 2.1 reading took Hα for C III].' });
    expect(settled.status).toBe(200);
    expect((await lead.get('/api/campaigns/1/disagreements')).body).toEqual([]);
    const again = await lead.post(`/api/disagreements/${d.id}/settle`).send({ choice: 'second', reason: 'changed my mind' });
    expect(again.status).toBe(409);
    const history = (await observer.get(`/api/spectra/${d.spectrumId}/confirmed`)).body.history;
    expect(history).toEqual([
      expect.objectContaining({ method: 'settlement', z: 0.5003, grade: 'likely', decidedBy: 'Lena Demo (lead)', reason: 'Hα + [N II] resolved; the 2.1 reading took Hα for C III].', isCurrent: true }),
    ]);
  });

  it('corrects a released value with a new record that supersedes it, deleting nothing', async () => {
    const id = ids[1]!;
    const res = await lead.post(`/api/spectra/${id}/corrections`).send({ z: 0.50034, zErr: 0.00005, grade: 'sure', class: 'galaxy', lines: ['H-alpha'], reason: 'Refit with the sky-line mask.' });
    expect(res.status).toBe(200);
    const history = (await lead.get(`/api/spectra/${id}/confirmed`)).body.history;
    expect(history.map((h: { method: string; isCurrent: boolean; z: number }) => [h.method, h.isCurrent, h.z])).toEqual([
      ['settlement', false, 0.5003],
      ['correction', true, 0.50034],
    ]);
    expect(history[1].supersedesId).toBe(history[0].id);
    expect(t.ctx.db.select().from(confirmedRedshifts).where(eq(confirmedRedshifts.spectrumId, id)).all()).toHaveLength(2);
    expect((await reader1.post(`/api/spectra/${id}/corrections`).send({ z: 1, grade: 'sure', class: 'galaxy', reason: 'mine' })).status).toBe(403);
    const unconfirmed = await lead.post(`/api/spectra/${ids[2]}/corrections`).send({ z: 1, grade: 'sure', class: 'galaxy', reason: 'nothing to correct' });
    expect(unconfirmed.status).toBe(409);
    expect(unconfirmed.body.error.code).toBe('not_confirmed');
  });
});

describe('a third reader', () => {
  it('settles a disagreement the lead hands over, and only that one', async () => {
    const id = ids[2]!;
    await reader1.post(`/api/spectra/${id}/readings`).send({ z: 0.7, grade: 'sure', class: 'galaxy' });
    await reader2.post(`/api/spectra/${id}/readings`).send({ z: 0.7, grade: 'sure', class: 'quasar' });
    const d = (await lead.get('/api/campaigns/1/disagreements')).body.find((x: { spectrumId: number }) => x.spectrumId === id);
    expect(d.reasons).toEqual(['class']);

    // The installation admin joins as a reader, so there is someone who made neither reading.
    const adminId = userIdOf(t, 'admin@demo.test');
    t.ctx.db.insert(memberships).values({ userId: adminId, campaignId: 1, role: 'reader' }).run();
    expect((await lead.post(`/api/disagreements/${d.id}/delegate`).send({ readerId: userIdOf(t, 'reader1@demo.test') })).body.error.code).toBe('not_independent');
    expect((await lead.post(`/api/disagreements/${d.id}/delegate`).send({ readerId: userIdOf(t, 'observer@demo.test') })).body.error.code).toBe('not_a_reader');
    const delegated = await lead.post(`/api/disagreements/${d.id}/delegate`).send({ readerId: adminId });
    expect(delegated.status).toBe(200);
    const mail = t.ctx.db.select().from(mailMessages).orderBy(desc(mailMessages.id)).get()!;
    expect(mail).toMatchObject({ toAddress: 'admin@demo.test', subject: 'A disagreement for you to settle' });

    const third = await t.signIn('admin@demo.test');
    const mine = (await third.get('/api/campaigns/1/disagreements')).body;
    expect(mine.map((x: { id: number; delegatedTo: { name: string } }) => [x.id, x.delegatedTo.name])).toEqual([[d.id, 'Ada Demo (admin)']]);
    expect((await reader2.post(`/api/disagreements/${d.id}/settle`).send({ choice: 'second', reason: 'mine is right' })).status).toBe(403);
    const settled = await third.post(`/api/disagreements/${d.id}/settle`).send({ choice: 'first', reason: 'No broad lines: a galaxy.' });
    expect(settled.status).toBe(200);
    const history = (await lead.get(`/api/spectra/${id}/confirmed`)).body.history;
    expect(history[0]).toMatchObject({ method: 'settlement', class: 'galaxy', z: 0.7, decidedBy: 'Ada Demo (admin)' });
  });
});
