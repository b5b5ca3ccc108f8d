import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, TEST_ORIGIN, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.cleanup());

describe('sign-in', () => {
  it('signs in with the demo password and reports who is signed in', async () => {
    const agent = t.agent();
    const login = await agent.post('/api/auth/login').send({ email: 'Reader1@Demo.test ', password: 'redward-demo' });
    expect(login.status).toBe(200);
    expect(login.body.user).toMatchObject({ email: 'reader1@demo.test', isAdmin: false });
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('reader1@demo.test');
  });

  it('sets an httpOnly, SameSite=Lax session cookie, not Secure over plain http', async () => {
    const res = await t.agent().post('/api/auth/login').send({ email: 'lead@demo.test', password: 'redward-demo' });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/^redward_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/;\s*Secure/i);
  });

  it('gives the same generic 401 for a wrong password and an unknown account', async () => {
    const wrong = await t.agent().post('/api/auth/login').send({ email: 'lead@demo.test', password: 'not-the-password' });
    const unknown = await t.agent().post('/api/auth/login').send({ email: 'ghost@demo.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual({ error: { code: 'invalid_credentials', message: 'The e-mail or password is not right.' } });
    expect(unknown.body).toEqual(wrong.body);
  });

  it('answers 429 with a retry time once one address has failed five times for one account', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) {
      const res = await t.agent().post('/api/auth/login').send({ email: 'observer@demo.test', password: `guess-${i}` });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429, 429, 429, 429, 429, 429]);
    // The right password from the same address waits too: otherwise the guesser would learn it.
    const blocked = await t.agent().post('/api/auth/login').send({ email: 'observer@demo.test', password: 'redward-demo' });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('too_many_attempts');
    expect(blocked.body.error.message).toBe('Too many failed sign-in attempts. Try again in 1 second.');
    expect(Number(blocked.headers['retry-after'])).toBe(1);
    // Once the wait is over the person gets in, and their earlier typos are forgiven.
    t.clock.advanceHours(1 / 3600);
    expect((await t.agent().post('/api/auth/login').send({ email: 'observer@demo.test', password: 'redward-demo' })).status).toBe(200);
    expect((await t.agent().post('/api/auth/login').send({ email: 'observer@demo.test', password: 'guess-again' })).status).toBe(401);
  });

  it('signs out', async () => {
    const agent = await t.signIn('reader2@demo.test');
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('refuses a disabled account with the generic message', async () => {
    const admin = await t.signIn('admin@demo.test');
    const victim = await t.signIn('reader2@demo.test');
    const users = (await admin.get('/api/admin/users')).body.users as { id: number; email: string }[];
    const id = users.find((u) => u.email === 'reader2@demo.test')!.id;
    expect((await admin.patch(`/api/admin/users/${id}`).send({ disabled: true })).status).toBe(200);
    expect((await victim.get('/api/auth/me')).status).toBe(401);
    const login = await t.agent().post('/api/auth/login').send({ email: 'reader2@demo.test', password: 'redward-demo' });
    expect(login.status).toBe(401);
    expect(login.body.error.code).toBe('invalid_credentials');
    await admin.patch(`/api/admin/users/${id}`).send({ disabled: false });
  });

  it('does not let an admin lock themselves out', async () => {
    const admin = await t.signIn('admin@demo.test');
    const me = (await admin.get('/api/auth/me')).body.user;
    const res = await admin.patch(`/api/admin/users/${me.id}`).send({ isAdmin: false });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('self_lockout');
  });
});

describe('change password', () => {
  it('requires the current password, keeps this session and ends the others', async () => {
    const here = await t.signIn('reader1@demo.test');
    const elsewhere = await t.signIn('reader1@demo.test');
    const wrong = await here.post('/api/account/password').send({ currentPassword: 'nope', newPassword: 'a new long passphrase' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('wrong_password');
    const short = await here.post('/api/account/password').send({ currentPassword: 'redward-demo', newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.message).toMatch(/newPassword: Use at least 10 characters/);

    const ok = await here.post('/api/account/password').send({ currentPassword: 'redward-demo', newPassword: 'a new long passphrase' });
    expect(ok.status).toBe(204);
    expect((await here.get('/api/auth/me')).status).toBe(200);
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401);
    expect((await t.agent().post('/api/auth/login').send({ email: 'reader1@demo.test', password: 'redward-demo' })).status).toBe(401);
    expect((await t.agent().post('/api/auth/login').send({ email: 'reader1@demo.test', password: 'a new long passphrase' })).status).toBe(200);
  });
});

describe('bad input never leaks internals', () => {
  it('answers malformed JSON with 400 and a sentence', async () => {
    const res = await request(t.app).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": "lead@demo.test",');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'malformed_json', message: 'The request body is not valid JSON.' } });
  });

  it('answers an unknown API route with 404 JSON', async () => {
    const res = await request(t.app).get('/api/no/such/thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body.error).toEqual({ code: 'route_not_found', message: 'No API route GET /no/such/thing.' });
  });

  it('names the field that failed validation', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.post('/api/campaigns').send({ name: 'Range test', zMin: 5, zMax: 2 });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('zMax: The lowest redshift must be below the highest.');
    const extra = await lead.patch('/api/campaigns/1').send({ tolerance: 0.002, owner: 'me' });
    expect(extra.status).toBe(400);
    expect(extra.body.error.message).toMatch(/unexpected field\(s\) owner/);
  });

  it('rejects a grade scheme with duplicate codes', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.patch('/api/campaigns/1').send({
      gradeScheme: [
        { code: 'a', label: 'yes', meaning: '' },
        { code: 'A', label: 'no', meaning: '' },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/Grade codes must be unique/);
  });

  it('never includes a stack trace', async () => {
    const responses = await Promise.all([
      request(t.app).post('/api/auth/login').set('Content-Type', 'application/json').send('nope'),
      request(t.app).get('/api/campaigns/abc'),
      request(t.app).post('/api/invitations/x/accept').set('Origin', TEST_ORIGIN).send({ name: 1 }),
    ]);
    for (const r of responses) expect(JSON.stringify(r.body)).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it('sets protective headers', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.body).toEqual({ ok: true, version: t.ctx.config.version });
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('behind an https proxy', () => {
  it('marks the session cookie Secure', async () => {
    const proxied = await createTestApp({ TRUST_PROXY: '1' });
    try {
      const res = await request(proxied.app)
        .post('/api/auth/login')
        .set('X-Forwarded-Proto', 'https')
        .send({ email: 'lead@demo.test', password: 'redward-demo' });
      expect(res.status).toBe(200);
      expect(String(res.headers['set-cookie'])).toMatch(/;\s*Secure/i);
    } finally {
      await proxied.cleanup();
    }
  });
});
