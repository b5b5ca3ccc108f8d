import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_GRADE_SCHEME } from '../../backend/src/contracts/grades';
import { auditEvents } from '../../backend/src/db/schema';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.cleanup());

describe('campaigns', () => {
  it('seeds the demo campaigns with the members each demo account should see', async () => {
    const observer = await t.signIn('observer@demo.test');
    const admin = await t.signIn('admin@demo.test');
    const forObserver = (await observer.get('/api/campaigns')).body.campaigns;
    const forAdmin = (await admin.get('/api/campaigns')).body.campaigns;
    expect(forObserver.map((c: { name: string }) => c.name)).toEqual(['Lantern Cluster arcs']);
    expect(forAdmin.map((c: { name: string; myRole: null }) => [c.name, c.myRole])).toEqual([
      ['Lantern Cluster arcs', null],
      ['Tidewater Deep Field dropouts', null],
    ]);
    expect(forObserver[0]).toMatchObject({ zMin: 0, zMax: 9, tolerance: 0.003, gridStep: 'default', memberCount: 4, myRole: 'observer' });
  });

  it('creates a campaign with the PRODUCT.md defaults and makes the creator its lead', async () => {
    const reader = await t.signIn('reader2@demo.test');
    const res = await reader.post('/api/campaigns').send({ name: 'Quasar pairs pilot' });
    expect(res.status).toBe(201);
    expect(res.body.campaign).toMatchObject({
      name: 'Quasar pairs pilot',
      description: '',
      zMin: 0,
      zMax: 9,
      tolerance: 0.003,
      gridStep: 'default',
      myRole: 'lead',
      memberCount: 1,
      gradeScheme: DEFAULT_GRADE_SCHEME,
    });
    // Our own default: codes are words, grades are named by the chance the redshift is right.
    expect(res.body.campaign.gradeScheme.map((g: { code: string; label: string }) => `${g.code}:${g.label}`)).toEqual([
      'sure:sure',
      'likely:likely',
      'possible:possible',
      'no-z:no redshift',
      'unusable:unusable',
    ]);
    expect(res.body.campaign.gradeScheme.map((g: { meaning: string }) => g.meaning.match(/^(At least 99|About 90|About 70) %/)?.[1] ?? null)).toEqual(['At least 99', 'About 90', 'About 70', null, null]);
  });

  it('records each settings change with the values before and after', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.patch('/api/campaigns/2').send({ zMin: 3.5, tolerance: 0.002 });
    expect(res.status).toBe(200);
    expect(res.body.campaign).toMatchObject({ zMin: 3.5, zMax: 9, tolerance: 0.002 });
    const event = t.ctx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.campaignId, 2), eq(auditEvents.action, 'campaign.updated')))
      .get()!;
    expect(event.before).toEqual({ zMin: 0, tolerance: 0.005 });
    expect(event.after).toEqual({ zMin: 3.5, tolerance: 0.002 });
  });

  it('refuses a change that would invert the stored redshift range', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.patch('/api/campaigns/2').send({ zMax: 2 });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('The lowest redshift (3.5) must be below the highest (2).');
  });

  it('lets a lead rename and extend the grade scheme', async () => {
    const lead = await t.signIn('lead@demo.test');
    const scheme = [...DEFAULT_GRADE_SCHEME, { code: 'star', label: 'star contaminant', meaning: 'A Milky Way cool dwarf.' }];
    const res = await lead.patch('/api/campaigns/1').send({ gradeScheme: scheme });
    expect(res.status).toBe(200);
    expect(res.body.campaign.gradeScheme).toHaveLength(6);
    expect(res.body.campaign.gradeScheme[5]).toEqual({ code: 'star', label: 'star contaminant', meaning: 'A Milky Way cool dwarf.' });
  });

  it('reads a numeric code from an older script as its digits, and refuses a code with spaces', async () => {
    const lead = await t.signIn('lead@demo.test');
    const digits = await lead.patch('/api/campaigns/1').send({ gradeScheme: [{ code: 2, label: 'good', meaning: '' }, { code: 1, label: 'poor', meaning: '' }] });
    expect(digits.status).toBe(200);
    expect(digits.body.campaign.gradeScheme.map((g: { code: string }) => g.code)).toEqual(['2', '1']);
    const spaced = await lead.patch('/api/campaigns/1').send({ gradeScheme: [{ code: 'very sure', label: 'a', meaning: '' }, { code: 'b', label: 'b', meaning: '' }] });
    expect(spaced.status).toBe(400);
    expect(spaced.body.error.message).toMatch(/without spaces/);
    expect((await lead.patch('/api/campaigns/1').send({ gradeScheme: DEFAULT_GRADE_SCHEME })).status).toBe(200);
  });

  it("creates a campaign that scans on each file's own sampling", async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns').send({ name: 'Prism dropouts', gridStep: 'native' });
    expect(res.status).toBe(201);
    expect(res.body.campaign).toMatchObject({ name: 'Prism dropouts', gridStep: 'native', zMin: 0, zMax: 9 });
    const again = await lead.get(`/api/campaigns/${res.body.campaign.id}`);
    expect(again.body.campaign.gridStep).toBe('native');
    const event = t.ctx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.campaignId, res.body.campaign.id), eq(auditEvents.action, 'campaign.created')))
      .get()!;
    expect(event.after).toMatchObject({ gridStep: 'native' });
  });

  it('switches the scan grid and records the change', async () => {
    const lead = await t.signIn('lead@demo.test');
    const id = (await lead.post('/api/campaigns').send({ name: 'Grid switch' })).body.campaign.id;
    const res = await lead.patch(`/api/campaigns/${id}`).send({ gridStep: 'native' });
    expect(res.status).toBe(200);
    expect(res.body.campaign.gridStep).toBe('native');
    const event = t.ctx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.campaignId, id), eq(auditEvents.action, 'campaign.updated')))
      .get()!;
    expect(event.before).toEqual({ gridStep: 'default' });
    expect(event.after).toEqual({ gridStep: 'native' });
  });

  it('refuses a scan grid other than default or native, changing nothing', async () => {
    const lead = await t.signIn('lead@demo.test');
    const message = 'gridStep: The scan grid is either "default" or "native".';
    const created = await lead.post('/api/campaigns').send({ name: 'Odd grid', gridStep: '5e-5' });
    expect(created.status).toBe(400);
    expect(created.body).toEqual({ error: { code: 'invalid_input', message } });
    const updated = await lead.patch('/api/campaigns/1').send({ gridStep: 'fine' });
    expect(updated.status).toBe(400);
    expect(updated.body).toEqual({ error: { code: 'invalid_input', message } });
    expect((await lead.get('/api/campaigns/1')).body.campaign.gridStep).toBe('default');
  });

  it('answers 404 for a campaign that does not exist', async () => {
    const admin = await t.signIn('admin@demo.test');
    const res = await admin.get('/api/campaigns/999');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('campaign_not_found');
  });
});
