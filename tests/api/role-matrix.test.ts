import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Router } from 'express';
import request from 'supertest';
import { jobs } from '../../backend/src/db/schema';
import { createTestApp, TEST_ORIGIN, type TestApp } from '../helpers/test-app';

type Who = 'anonymous' | 'observer' | 'reader' | 'lead' | 'admin';
const WHO: Who[] = ['anonymous', 'observer', 'reader', 'lead', 'admin'];
const EMAIL: Record<Exclude<Who, 'anonymous'>, string> = {
  observer: 'observer@demo.test',
  reader: 'reader1@demo.test',
  lead: 'lead@demo.test',
  admin: 'admin@demo.test',
};

interface Case {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  /** The route pattern as registered; `url` fills in the parameters. */
  route: string;
  url: string;
  body?: () => object;
  expect: Record<Who, number>;
}

const all = (status: number) => ({ anonymous: status, observer: status, reader: status, lead: status, admin: status });
const signedIn = (status: number) => ({ ...all(status), anonymous: 401 });
const leadOnly = (ok: number) => ({ anonymous: 401, observer: 403, reader: 403, lead: ok, admin: 403 });
const adminOnly = (ok: number) => ({ anonymous: 401, observer: 403, reader: 403, lead: 403, admin: ok });
let unique = 0;

// Campaign 1 (Lantern Cluster arcs) has all four demo members; campaign 2 has no observer.
const CASES: Case[] = [
  { method: 'get', route: '/health', url: '/api/health', expect: all(200) },
  { method: 'post', route: '/auth/login', url: '/api/auth/login', body: () => ({ email: 'nobody@demo.test', password: 'wrong' }), expect: all(401) },
  { method: 'get', route: '/auth/me', url: '/api/auth/me', expect: signedIn(200) },
  { method: 'patch', route: '/account', url: '/api/account', body: () => ({ name: 'Renamed Person' }), expect: signedIn(200) },
  // A wrong current password: the route is reachable (400), never silently accepted.
  { method: 'post', route: '/account/password', url: '/api/account/password', body: () => ({ currentPassword: 'not-it', newPassword: 'a-brand-new-passphrase' }), expect: signedIn(400) },
  { method: 'get', route: '/campaigns', url: '/api/campaigns', expect: signedIn(200) },
  { method: 'post', route: '/campaigns', url: '/api/campaigns', body: () => ({ name: `Matrix campaign ${++unique}` }), expect: signedIn(201) },
  { method: 'get', route: '/campaigns/:id', url: '/api/campaigns/1', expect: signedIn(200) },
  { method: 'get', route: '/campaigns/:id', url: '/api/campaigns/2', expect: { anonymous: 401, observer: 404, reader: 200, lead: 200, admin: 200 } },
  // A reader (and an observer) trying to change campaign settings.
  { method: 'patch', route: '/campaigns/:id', url: '/api/campaigns/1', body: () => ({ tolerance: 0.004 }), expect: leadOnly(200) },
  { method: 'get', route: '/campaigns/:id/members', url: '/api/campaigns/1/members', expect: signedIn(200) },
  // An observer (and a reader) trying to invite.
  { method: 'post', route: '/campaigns/:id/members', url: '/api/campaigns/1/members', body: () => ({ email: `matrix${++unique}@example.org`, role: 'reader' }), expect: leadOnly(201) },
  { method: 'get', route: '/invitations/:token', url: '/api/invitations/not-a-real-token', expect: all(404) },
  { method: 'post', route: '/invitations/:token/accept', url: '/api/invitations/not-a-real-token/accept', body: () => ({}), expect: all(404) },
  { method: 'get', route: '/admin/users', url: '/api/admin/users', expect: adminOnly(200) },
  { method: 'patch', route: '/admin/users/:userId', url: '/api/admin/users/5', body: () => ({ disabled: false }), expect: adminOnly(200) },
  // A user who does not exist, so the matrix's own sessions survive.
  { method: 'post', route: '/admin/users/:userId/sign-out-everywhere', url: '/api/admin/users/999/sign-out-everywhere', expect: adminOnly(404) },
  { method: 'get', route: '/admin/mail', url: '/api/admin/mail', expect: adminOnly(200) },
  { method: 'get', route: '/admin/mail/:mailId', url: '/api/admin/mail/999', expect: adminOnly(404) },
  // Lead without a file: the route is reached (400), the others are refused first.
  { method: 'post', route: '/campaigns/:id/uploads', url: '/api/campaigns/1/uploads', body: () => ({}), expect: leadOnly(400) },
  { method: 'post', route: '/campaigns/:id/targets', url: '/api/campaigns/1/targets', body: () => ({}), expect: leadOnly(400) },
  { method: 'get', route: '/campaigns/:id/spectra', url: '/api/campaigns/1/spectra', expect: signedIn(200) },
  { method: 'get', route: '/campaigns/:id/targets', url: '/api/campaigns/1/targets', expect: signedIn(200) },
  // No targets in the matrix's campaign: reachable for every viewer, answered with target_not_found.
  { method: 'get', route: '/campaigns/:id/targets/:targetId/photometry', url: '/api/campaigns/1/targets/1/photometry', expect: signedIn(404) },
  { method: 'get', route: '/campaigns/:id/filters', url: '/api/campaigns/1/filters', expect: signedIn(200) },
  // Without a file: reachable for the lead only (400 no_files).
  { method: 'post', route: '/campaigns/:id/filters', url: '/api/campaigns/1/filters', body: () => ({}), expect: leadOnly(400) },
  { method: 'patch', route: '/spectra/:spectrumId/target', url: '/api/spectra/999/target', body: () => ({ targetId: null }), expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/jobs/:jobId', url: '/api/jobs/1', expect: leadOnly(200) },
  { method: 'get', route: '/jobs/:jobId/files', url: '/api/jobs/1/files', expect: leadOnly(200) },
  { method: 'post', route: '/jobs/:jobId/cancel', url: '/api/jobs/1/cancel', expect: leadOnly(200) },
  { method: 'get', route: '/jobs/:jobId/events', url: '/api/jobs/1/events', expect: leadOnly(200) },
  { method: 'get', route: '/campaigns/:id/jobs', url: '/api/campaigns/1/jobs', expect: leadOnly(200) },
  { method: 'get', route: '/campaigns/:id/scan-status', url: '/api/campaigns/1/scan-status', expect: signedIn(200) },
  // No spectra yet: the lead reaches the route and is told there is nothing to re-scan.
  { method: 'post', route: '/campaigns/:id/rescans', url: '/api/campaigns/1/rescans', body: () => ({}), expect: leadOnly(400) },
  { method: 'get', route: '/jobs/:jobId', url: '/api/jobs/999', expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/me/queue', url: '/api/me/queue?campaign=1', expect: { anonymous: 401, observer: 403, reader: 200, lead: 200, admin: 404 } },
  { method: 'get', route: '/line-list', url: '/api/line-list', expect: signedIn(200) },
  // Spectrum routes on a spectrum that does not exist: signed-in people learn only that.
  { method: 'get', route: '/spectra/:spectrumId', url: '/api/spectra/999', expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/spectra/:spectrumId/data', url: '/api/spectra/999/data', expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/spectra/:spectrumId/scan-curves', url: '/api/spectra/999/scan-curves', expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/spectra/:spectrumId/lines', url: '/api/spectra/999/lines?z=1', expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/spectra/:spectrumId/solutions/:rank/model', url: '/api/spectra/999/solutions/1/model', expect: { ...all(404), anonymous: 401 } },
  { method: 'post', route: '/spectra/:spectrumId/readings', url: '/api/spectra/999/readings', body: () => ({ z: 1, grade: 'sure', class: 'galaxy' }), expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/campaigns/:id/disagreements', url: '/api/campaigns/1/disagreements', expect: { anonymous: 401, observer: 403, reader: 200, lead: 200, admin: 403 } },
  { method: 'post', route: '/disagreements/:disagreementId/delegate', url: '/api/disagreements/999/delegate', body: () => ({ readerId: 3 }), expect: { ...all(404), anonymous: 401 } },
  { method: 'post', route: '/disagreements/:disagreementId/settle', url: '/api/disagreements/999/settle', body: () => ({ choice: 'first', reason: 'test' }), expect: { ...all(404), anonymous: 401 } },
  { method: 'post', route: '/spectra/:spectrumId/corrections', url: '/api/spectra/999/corrections', body: () => ({ z: 1, grade: 'sure', class: 'galaxy', reason: 'test' }), expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/spectra/:spectrumId/confirmed', url: '/api/spectra/999/confirmed', expect: { ...all(404), anonymous: 401 } },
  { method: 'post', route: '/campaigns/:id/assignments', url: '/api/campaigns/1/assignments', body: () => ({ readerIds: [3, 4] }), expect: leadOnly(200) },
  { method: 'get', route: '/spectra/:spectrumId/assignments', url: '/api/spectra/999/assignments', expect: { ...all(404), anonymous: 401 } },
  { method: 'put', route: '/spectra/:spectrumId/assignments', url: '/api/spectra/999/assignments', body: () => ({ readingOrder: 'first', readerId: 3 }), expect: { ...all(404), anonymous: 401 } },
  { method: 'get', route: '/account/tokens', url: '/api/account/tokens', expect: signedIn(200) },
  { method: 'post', route: '/account/tokens', url: '/api/account/tokens', body: () => ({ name: 'matrix' }), expect: signedIn(201) },
  { method: 'delete', route: '/account/tokens/:tokenId', url: '/api/account/tokens/999', expect: signedIn(404) },
  { method: 'get', route: '/campaigns/:id/confirmed', url: '/api/campaigns/1/confirmed', expect: signedIn(200) },
  { method: 'get', route: '/campaigns/:id/statistics', url: '/api/campaigns/1/statistics', expect: signedIn(200) },
  { method: 'get', route: '/campaigns/:id/families', url: '/api/campaigns/1/families', expect: signedIn(200) },
  { method: 'get', route: '/admin/worker-tokens', url: '/api/admin/worker-tokens', expect: adminOnly(200) },
  { method: 'post', route: '/admin/worker-tokens', url: '/api/admin/worker-tokens', body: () => ({ name: `node ${++unique}` }), expect: adminOnly(201) },
  { method: 'delete', route: '/admin/worker-tokens/:tokenId', url: '/api/admin/worker-tokens/999', expect: adminOnly(404) },
  // Scan-worker routes: no person passes, whatever their role (a worker token is needed).
  { method: 'get', route: '/worker/items/:itemId/file', url: '/api/worker/items/1/file', expect: { ...all(403), anonymous: 401 } },
  { method: 'post', route: '/worker/items/:itemId/result', url: '/api/worker/items/1/result', body: () => ({}), expect: { ...all(403), anonymous: 401 } },
  { method: 'get', route: '/openapi.json', url: '/api/openapi.json', expect: all(200) },
  { method: 'get', route: '/docs', url: '/api/docs', expect: all(200) },
  { method: 'post', route: '/auth/logout', url: '/api/auth/logout', expect: all(204) },
];

let t: TestApp;
const agents = new Map<Who, ReturnType<TestApp['agent']>>();

beforeAll(async () => {
  // No runner: the queued job below stays queued until the lead cancels it.
  t = await createTestApp({ JOB_RUNNER: '0' });
  t.ctx.db.insert(jobs).values({ kind: 'ingest', campaignId: 1, total: 0, settings: { zMin: 0, zMax: 9 } }).run();
  agents.set('anonymous', t.agent());
  for (const who of WHO) if (who !== 'anonymous') agents.set(who, await t.signIn(EMAIL[who]));
});
afterAll(() => t.cleanup());

describe('role matrix: every route × every role', () => {
  for (const c of CASES) {
    for (const who of WHO) {
      it(`${c.method.toUpperCase()} ${c.url} as ${who} → ${c.expect[who]}`, async () => {
        // Logging out ends the agent's session, so use a fresh sign-in for that case.
        const agent = c.route === '/auth/logout' && who !== 'anonymous' ? await t.signIn(EMAIL[who]) : agents.get(who)!;
        let req = agent[c.method](c.url);
        if (c.body) req = req.send(c.body());
        const res = await req;
        expect(res.status, JSON.stringify(res.body)).toBe(c.expect[who]);
        if (res.status >= 400) {
          expect(res.body.error.code).toMatch(/^[a-z_]+$/);
          expect(res.body.error.message.length).toBeGreaterThan(5);
        }
      });
    }
  }

  it('covers every API route the application registers', () => {
    const registered = collectRoutes(apiRouter(t)).map((r) => `${r.method} ${r.path}`);
    const covered = new Set(CASES.map((c) => `${c.method} ${c.route}`));
    expect(registered.length).toBeGreaterThan(10);
    expect(registered.filter((r) => !covered.has(r))).toEqual([]);
  });

  it('hides a campaign from a signed-in non-member (404, not 403)', async () => {
    const res = await agents.get('observer')!.get('/api/campaigns/2/members');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('campaign_not_found');
  });
});

describe('cross-site requests', () => {
  it('refuses a cookie-authenticated change from another origin', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.patch('/api/campaigns/1').set('Origin', 'https://evil.example').send({ tolerance: 0.01 });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_rejected');
    const unchanged = await lead.get('/api/campaigns/1');
    expect(unchanged.body.campaign.tolerance).not.toBe(0.01);
  });

  it('accepts our own origin', async () => {
    const lead = await t.signIn('lead@demo.test');
    const res = await lead.patch('/api/campaigns/1').set('Origin', TEST_ORIGIN).send({ description: 'Updated by the lead.' });
    expect(res.status).toBe(200);
    expect(res.body.campaign.description).toBe('Updated by the lead.');
  });

  it('does not need an Origin for requests without a session cookie', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ email: 'lead@demo.test', password: 'redward-demo' });
    expect(res.status).toBe(200);
  });
});

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: Layer[] };
  name?: string;
}

function apiRouter(app: TestApp): Router {
  const stack = (app.app as unknown as { router: { stack: Layer[] } }).router.stack;
  const layer = stack.find((l) => l.handle.stack && l.handle.stack.some((s) => s.handle.stack));
  return layer!.handle as unknown as Router;
}

function collectRoutes(router: Router): { method: string; path: string }[] {
  const out: { method: string; path: string }[] = [];
  for (const layer of (router as unknown as { stack: Layer[] }).stack) {
    if (layer.route) {
      for (const m of Object.keys(layer.route.methods)) out.push({ method: m, path: layer.route.path });
    } else if (layer.handle.stack) {
      out.push(...collectRoutes(layer.handle as unknown as Router));
    }
  }
  return out;
}
