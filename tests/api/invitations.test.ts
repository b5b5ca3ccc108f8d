import { desc } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, mailMessages } from '../../backend/src/db/schema';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.cleanup());

/** Invites through the API and returns the token read from the e-mail the catcher received. */
async function invite(email: string, role: 'lead' | 'reader' | 'observer', campaignId = 1): Promise<string> {
  const lead = await t.signIn('lead@demo.test');
  const res = await lead.post(`/api/campaigns/${campaignId}/members`).send({ email, role });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  expect(res.body.invitation).toMatchObject({ email, role, invitedBy: 'Lena Demo (lead)' });
  const mail = t.ctx.db.select().from(mailMessages).orderBy(desc(mailMessages.id)).get()!;
  expect(mail.toAddress).toBe(email);
  const match = mail.textBody.match(/http:\/\/redward\.test\/invitations\/([A-Za-z0-9_-]{43})/);
  expect(match, mail.textBody).not.toBeNull();
  return match![1]!;
}

describe('invitations by e-mail', () => {
  it('sends the invitation through SMTP to the local catcher, readable by admins', async () => {
    await invite('new.reader@example.org', 'reader');
    const admin = await t.signIn('admin@demo.test');
    const list = await admin.get('/api/admin/mail');
    expect(list.status).toBe(200);
    const summary = list.body.messages[0];
    expect(summary).toMatchObject({ to: 'new.reader@example.org', subject: 'Invitation to join Lantern Cluster arcs on Redward' });
    expect(summary.from).toMatch(/redward@localhost/);
    const full = await admin.get(`/api/admin/mail/${summary.id}`);
    expect(full.body.message.text).toMatch(/invites you to join the campaign "Lantern Cluster arcs" on Redward as a reader/);
  });

  it('lets a new person set a password, signs them in and lands them in the campaign', async () => {
    const token = await invite('arc.hunter@example.org', 'reader');
    const person = t.agent();
    const preview = await person.get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ email: 'arc.hunter@example.org', role: 'reader', campaign: { id: 1, name: 'Lantern Cluster arcs' }, accountExists: false });

    const missing = await person.post(`/api/invitations/${token}/accept`).send({});
    expect(missing.status).toBe(400);

    const accepted = await person.post(`/api/invitations/${token}/accept`).send({ name: 'Arc Hunter', password: 'lensed-arcs-are-fun' });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ campaignId: 1, user: { email: 'arc.hunter@example.org', name: 'Arc Hunter' } });
    const campaigns = await person.get('/api/campaigns');
    expect(campaigns.body.campaigns.map((c: { name: string; myRole: string }) => [c.name, c.myRole])).toEqual([['Lantern Cluster arcs', 'reader']]);

    const members = await person.get('/api/campaigns/1/members');
    expect(members.body.members.some((m: { email: string; role: string }) => m.email === 'arc.hunter@example.org' && m.role === 'reader')).toBe(true);
    const audit = t.ctx.db.select().from(auditEvents).orderBy(desc(auditEvents.id)).get()!;
    expect(audit.action).toBe('invitation.accepted');
  });

  it('refuses a reused link with a clear message, also when submitted twice at once', async () => {
    const token = await invite('twice@example.org', 'observer');
    const a = t.agent();
    const b = t.agent();
    const [r1, r2] = await Promise.all([
      a.post(`/api/invitations/${token}/accept`).send({ name: 'Twice', password: 'twice-is-once-too-many' }),
      b.post(`/api/invitations/${token}/accept`).send({ name: 'Twice', password: 'twice-is-once-too-many' }),
    ]);
    expect([r1.status, r2.status].sort()).toEqual([200, 410]);
    const again = await t.agent().get(`/api/invitations/${token}`);
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');
    expect(again.body.error.message).toMatch(/already been used/);
  });

  it('refuses an expired link with the expiry date', async () => {
    const token = await invite('late@example.org', 'reader');
    t.clock.advanceHours(73);
    try {
      const res = await t.agent().post(`/api/invitations/${token}/accept`).send({ name: 'Late', password: 'too-late-for-this' });
      expect(res.status).toBe(410);
      expect(res.body.error.code).toBe('invitation_expired');
      expect(res.body.error.message).toMatch(/^This invitation expired on .* GMT\. Ask the campaign lead for a new one\.$/);
    } finally {
      t.clock.advanceHours(-73);
    }
  });

  it('makes someone with an account sign in as the invited address, then join', async () => {
    const token = await invite('observer@demo.test', 'reader', 2);
    const anonymous = await t.agent().post(`/api/invitations/${token}/accept`).send({});
    expect(anonymous.status).toBe(409);
    expect(anonymous.body.error.code).toBe('sign_in_required');

    const someoneElse = await t.signIn('reader2@demo.test');
    const wrong = await someoneElse.post(`/api/invitations/${token}/accept`).send({});
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.code).toBe('wrong_account');

    const observer = await t.signIn('observer@demo.test');
    expect((await observer.get('/api/campaigns/2')).status).toBe(404);
    const joined = await observer.post(`/api/invitations/${token}/accept`).send({});
    expect(joined.status).toBe(200);
    expect(joined.body.campaignId).toBe(2);
    expect((await observer.get('/api/campaigns/2')).body.campaign.myRole).toBe('reader');
  });

  it('does not invite someone who is already a member', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns/1/members').send({ email: 'reader1@demo.test', role: 'observer' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('reader1@demo.test is already a reader of this campaign.');
  });

  it('shows pending invitations to leads only', async () => {
    await invite('pending@example.org', 'observer');
    const lead = await t.signIn('lead@demo.test');
    const reader = await t.signIn('reader2@demo.test');
    const forLead = (await lead.get('/api/campaigns/1/members')).body;
    const forReader = (await reader.get('/api/campaigns/1/members')).body;
    expect(forLead.invitations.map((i: { email: string }) => i.email)).toContain('pending@example.org');
    expect(forReader.invitations).toEqual([]);
  });
});

describe('when mail cannot be sent', () => {
  it('says so and leaves no usable invitation behind', async () => {
    // Port 9 (discard) on loopback has no SMTP server: the send fails fast.
    const broken = await createTestApp({ SMTP_URL: 'smtp://127.0.0.1:9', MAIL_CATCHER: '0' });
    try {
      const lead = await broken.signIn('lead@demo.test');
      const res = await lead.post('/api/campaigns/1/members').send({ email: 'lost@example.org', role: 'reader' });
      expect(res.status).toBe(502);
      expect(res.body.error.code).toBe('mail_not_sent');
      const members = await lead.get('/api/campaigns/1/members');
      expect(members.body.invitations).toEqual([]);
    } finally {
      await broken.cleanup();
    }
  });
});
