import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, sessions, users } from '../../backend/src/db/schema';
import { createTestApp, TEST_ORIGIN, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ JOB_RUNNER: '0' });
});
afterAll(() => t.cleanup());

/** Signs in with a plain request and returns the session cookie, as an attacker who copied it would hold it. */
async function cookieOf(email: string, password = 'redward-demo'): Promise<string> {
  const res = await request(t.app).post('/api/auth/login').set('Origin', TEST_ORIGIN).send({ email, password });
  expect(res.status).toBe(200);
  return String(res.headers['set-cookie']).split(';')[0]!;
}
const me = (cookie: string) => request(t.app).get('/api/auth/me').set('Cookie', cookie);
const userId = (email: string) => t.ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email)).get()!.id;

describe('server-side sessions', () => {
  it('keeps only a session id in the cookie and one row per sign-in', async () => {
    const before = t.ctx.db.select().from(sessions).all().length;
    await cookieOf('observer@demo.test');
    const rows = t.ctx.db.select().from(sessions).where(eq(sessions.userId, userId('observer@demo.test'))).all();
    expect(t.ctx.db.select().from(sessions).all().length).toBe(before + 1);
    expect(rows.at(-1)).toMatchObject({ revokedAt: null });
    expect(rows.at(-1)!.id).toMatch(/^[A-Za-z0-9_-]{43}$/);
    // 14 days from sign-in.
    expect(Date.parse(rows.at(-1)!.expiresAt) - Date.parse(rows.at(-1)!.createdAt)).toBe(14 * 24 * 3600_000);
  });

  it('refuses the old cookie after sign-out, even replayed from elsewhere', async () => {
    const cookie = await cookieOf('reader2@demo.test');
    expect((await me(cookie)).status).toBe(200);
    const out = await request(t.app).post('/api/auth/logout').set('Origin', TEST_ORIGIN).set('Cookie', cookie);
    expect(out.status).toBe(204);
    const replay = await me(cookie);
    expect(replay.status).toBe(401);
    expect(replay.body.error.code).toBe('unauthenticated');
  });

  it('signing out one browser leaves the account’s other browsers signed in', async () => {
    const laptop = await cookieOf('reader2@demo.test');
    const desktop = await cookieOf('reader2@demo.test');
    await request(t.app).post('/api/auth/logout').set('Origin', TEST_ORIGIN).set('Cookie', laptop);
    expect((await me(laptop)).status).toBe(401);
    expect((await me(desktop)).status).toBe(200);
  });

  it('ends a session 14 days after sign-in', async () => {
    const cookie = await cookieOf('lead@demo.test');
    t.clock.advanceHours(14 * 24 - 1);
    expect((await me(cookie)).status).toBe(200);
    t.clock.advanceHours(2);
    expect((await me(cookie)).status).toBe(401);
  });

  it('a password change ends every other session, keeps this one, and leaves access tokens working', async () => {
    const here = await t.signIn('reader1@demo.test');
    const stolen = await cookieOf('reader1@demo.test');
    const { token } = (await here.post('/api/account/tokens').send({ name: 'survives password change' })).body;
    const changed = await here.post('/api/account/password').send({ currentPassword: 'redward-demo', newPassword: 'another long passphrase' });
    expect(changed.status).toBe(204);
    expect((await here.get('/api/auth/me')).status).toBe(200);
    expect((await me(stolen)).status).toBe(401);
    const viaToken = await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`);
    expect(viaToken.status).toBe(200);
    expect(viaToken.body.user.email).toBe('reader1@demo.test');
    const audit = t.ctx.db.select().from(auditEvents).where(eq(auditEvents.action, 'account.password_changed')).all().at(-1)!;
    expect(audit.after).toEqual({ sessionsEnded: 1 });
  });

  it('an admin signs a user out everywhere; the user’s tokens keep working', async () => {
    const admin = await t.signIn('admin@demo.test');
    const victim = 'reader2@demo.test';
    const a = await cookieOf(victim);
    const b = await cookieOf(victim);
    const agent = await t.signIn(victim);
    const { token } = (await agent.post('/api/account/tokens').send({ name: 'nightly' })).body;

    const listed = (await admin.get('/api/admin/users')).body.users.find((u: { email: string }) => u.email === victim);
    expect(listed.activeSessions).toBeGreaterThanOrEqual(3);

    const res = await admin.post(`/api/admin/users/${userId(victim)}/sign-out-everywhere`);
    expect(res.status).toBe(200);
    expect(res.body.sessionsEnded).toBe(listed.activeSessions);
    expect(res.body.user).toMatchObject({ email: victim, activeSessions: 0 });
    for (const cookie of [a, b]) expect((await me(cookie)).status).toBe(401);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    expect((await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`)).status).toBe(200);
    // The admin's own session is untouched, and the action is on the record.
    expect((await admin.get('/api/auth/me')).status).toBe(200);
    const audit = t.ctx.db.select().from(auditEvents).where(eq(auditEvents.action, 'user.signed_out_everywhere')).all().at(-1)!;
    expect(audit).toMatchObject({ subjectId: userId(victim), after: { sessionsEnded: listed.activeSessions } });
    // Signing in again works as usual.
    expect((await me(await cookieOf(victim))).status).toBe(200);
  });

  it('answers 404 for an unknown user and 403 for a non-admin', async () => {
    const admin = await t.signIn('admin@demo.test');
    const unknown = await admin.post('/api/admin/users/9999/sign-out-everywhere');
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('user_not_found');
    const lead = await t.signIn('lead@demo.test');
    expect((await lead.post(`/api/admin/users/${userId('reader2@demo.test')}/sign-out-everywhere`)).status).toBe(403);
  });
});
