import { desc, like } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mailMessages } from '../../backend/src/db/schema';
import { createTestApp, TEST_ORIGIN, waitForMail, type TestApp } from '../helpers/test-app';

// Behind a proxy (TRUST_PROXY), X-Forwarded-For names the client, so one test can speak from many addresses.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ TRUST_PROXY: '1', JOB_RUNNER: '0' });
});
afterAll(() => t.cleanup());

const login = (from: string, email: string, password: string) =>
  request(t.app).post('/api/auth/login').set('Origin', TEST_ORIGIN).set('X-Forwarded-For', from).send({ email, password });

describe('sign-in limits per address and account', () => {
  it('wrong passwords from one address do not lock the account out for another address', async () => {
    const attacker = '198.51.100.7';
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await login(attacker, 'lead@demo.test', `guess-${i}`)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429, 429, 429, 429]);
    expect((await login(attacker, 'lead@demo.test', 'redward-demo')).status).toBe(429);

    const owner = await login('203.0.113.20', 'lead@demo.test', 'redward-demo');
    expect(owner.status).toBe(200);
    expect(owner.body.user.email).toBe('lead@demo.test');
  });

  it('the pair’s wait doubles with each further failure', async () => {
    const from = '198.51.100.8';
    for (let i = 0; i < 5; i++) expect((await login(from, 'reader1@demo.test', `guess-${i}`)).status).toBe(401);
    const waits: number[] = [];
    for (let round = 0; round < 3; round++) {
      const refused = await login(from, 'reader1@demo.test', 'guess');
      expect(refused.status).toBe(429);
      const wait = Number(refused.headers['retry-after']);
      waits.push(wait);
      t.clock.advanceHours(wait / 3600);
      expect((await login(from, 'reader1@demo.test', `late-guess-${round}`)).status).toBe(401);
    }
    expect(waits).toEqual([1, 2, 4]);
  });

  it('stops an account guessed at from many addresses and e-mails the admins', async () => {
    const victim = 'reader2@demo.test';
    // 100 wrong passwords from 25 addresses, 4 each: under every per-address limit.
    for (let i = 0; i < 100; i++) {
      const res = await login(`10.1.${Math.floor(i / 4)}.${(i % 4) + 1}`, victim, `spray-${i}`);
      expect(res.status).toBe(401);
    }
    const stopped = await login('192.0.2.50', victim, 'redward-demo');
    expect(stopped.status).toBe(429);
    expect(stopped.body.error.message).toBe('Too many failed sign-in attempts for this account from many places; the administrators have been told. Try again in 15 minutes.');
    // Other accounts sign in as usual from the same address.
    expect((await login('192.0.2.50', 'observer@demo.test', 'redward-demo')).status).toBe(200);

    const mail = await waitForMail(() =>
      t.ctx.db.select().from(mailMessages).where(like(mailMessages.subject, 'Sign-ins to %')).orderBy(desc(mailMessages.id)).get(),
    );
    expect(mail.toAddress).toBe('admin@demo.test');
    expect(mail.subject).toBe(`Sign-ins to ${victim} stopped after 100 failed attempts`);
    expect(mail.textBody).toContain(`Redward received 100 wrong passwords for ${victim} within 15 minutes.`);
    expect(mail.textBody).not.toContain('No account has this address');
    // One alert per window, however long the attack goes on.
    for (let i = 0; i < 5; i++) await login(`10.2.0.${i + 1}`, victim, 'more');
    await new Promise((r) => setTimeout(r, 300));
    expect(t.ctx.db.select().from(mailMessages).where(like(mailMessages.subject, 'Sign-ins to %')).all()).toHaveLength(1);

    t.clock.advanceHours(0.25);
    expect((await login('192.0.2.50', victim, 'redward-demo')).status).toBe(200);
  }, 60_000);
});
