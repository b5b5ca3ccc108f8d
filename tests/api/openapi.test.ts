import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ JOB_RUNNER: '0' });
});
afterAll(() => t.cleanup());

describe('the OpenAPI document', () => {
  it('describes every route with its access rule and the zod schemas of its input', async () => {
    const res = await request(t.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    const doc = res.body;
    expect(doc.openapi).toBe('3.1.0');
    const operations = Object.entries(doc.paths as Record<string, Record<string, { description: string }>>).flatMap(([path, ops]) => Object.keys(ops).map((m) => `${m} ${path}`));
    expect(operations.length).toBeGreaterThan(40);
    expect(operations).toContain('post /api/spectra/{spectrumId}/readings');
    const login = doc.paths['/api/auth/login'].post;
    expect(login.security).toEqual([]);
    expect(Object.keys(login.requestBody.content['application/json'].schema.properties)).toEqual(['email', 'password']);
    const reading = doc.paths['/api/spectra/{spectrumId}/readings'].post;
    expect(reading.description).toBe('Who may call it: Members of the campaign with the role: lead, reader.');
    expect(reading.requestBody.content['application/json'].schema.properties.class.enum).toEqual(['galaxy', 'quasar', 'star', 'lyman-break', 'unknown']);
    const confirmed = doc.paths['/api/campaigns/{id}/confirmed'].get;
    expect(confirmed.parameters.find((p: { name: string }) => p.name === 'format').schema.enum).toEqual(['json', 'csv', 'ecsv', 'votable', 'fits']);
    expect(doc.components.securitySchemes.token).toEqual({ type: 'http', scheme: 'bearer' });
  });

  it('has a page for people', async () => {
    const res = await request(t.app).get('/api/docs');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/html/);
    expect(res.text).toContain('<code>/api/campaigns/{id}/confirmed</code>');
  });
});
