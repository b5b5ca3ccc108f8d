import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiTokens } from '../../backend/src/db/schema';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ JOB_RUNNER: '0' });
});
afterAll(() => t.cleanup());

describe('personal access tokens', () => {
  it('is shown once, stored hashed, and works as a Bearer token under the same role rules', async () => {
    const reader = await t.signIn('reader1@demo.test');
    const created = await reader.post('/api/account/tokens').send({ name: 'nightly export script' });
    expect(created.status).toBe(201);
    const token: string = created.body.token;
    expect(token).toMatch(/^rwpat_[A-Za-z0-9_-]{43}$/);
    expect(created.body.apiToken).toMatchObject({ name: 'nightly export script', prefix: token.slice(0, 12), revokedAt: null });
    const stored = t.ctx.db.select().from(apiTokens).all();
    expect(JSON.stringify(stored)).not.toContain(token);
    expect((await reader.get('/api/account/tokens')).body.tokens[0]).not.toHaveProperty('token');

    const bearer = (req: request.Test) => req.set('Authorization', `Bearer ${token}`);
    const campaigns = await bearer(request(t.app).get('/api/campaigns'));
    expect(campaigns.status).toBe(200);
    expect(campaigns.body.campaigns.map((c: { myRole: string }) => c.myRole)).toEqual(['reader', 'reader']);
    // A token carries its person's role: a reader's token cannot change campaign settings.
    const patch = await bearer(request(t.app).patch('/api/campaigns/1').send({ tolerance: 0.01 }));
    expect(patch.status).toBe(403);
    expect(t.ctx.db.select().from(apiTokens).get()!.lastUsedAt).not.toBeNull();
  });

  it('refuses a revoked or made-up token', async () => {
    const reader = await t.signIn('reader2@demo.test');
    const { token, apiToken } = (await reader.post('/api/account/tokens').send({ name: 'to revoke' })).body;
    expect((await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`)).status).toBe(200);
    const revoked = await reader.delete(`/api/account/tokens/${apiToken.id}`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.apiToken.revokedAt).not.toBeNull();
    const refused = await request(t.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`);
    expect(refused.status).toBe(401);
    expect(refused.body.error.code).toBe('invalid_token');
    expect((await request(t.app).get('/api/auth/me').set('Authorization', 'Bearer rwpat_madeup')).status).toBe(401);
    expect((await reader.delete(`/api/account/tokens/${apiToken.id}`)).body.error.code).toBe('token_revoked');
    const other = await t.signIn('reader1@demo.test');
    expect((await other.delete(`/api/account/tokens/${apiToken.id}`)).status).toBe(404);
  });
});
