import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openApiDocumentSchema } from '../../backend/src/contracts/openapi';
import { createTestApp, type TestApp } from '../helpers/test-app';

/*
 * The documented operations that answer something other than JSON, and so declare no response
 * schema. Anything not listed here must have one: a new JSON route without `response` fails.
 */
const NOT_JSON = new Map([
  // 204 No Content on success.
  ['post /api/account/password', '204: the password changed, this session kept'],
  ['post /api/auth/logout', '204: the session ended'],
  // Binary: packed float arrays the inspection screen reads directly.
  ['get /api/spectra/{spectrumId}/data', 'octet stream: the spectrum arrays'],
  ['get /api/spectra/{spectrumId}/solutions/{rank}/model', 'octet stream: float32 model on the pixels'],
  ['get /api/spectra/{spectrumId}/scan-curves', 'octet stream: χ²(z) curves as stored (contracts/scan-curves-binary.ts)'],
  ['get /api/worker/items/{itemId}/file', 'octet stream: the stored file a scan worker reads'],
  // Server-sent events.
  ['get /api/jobs/{jobId}/events', 'text/event-stream: job progress'],
  // HTML for people.
  ['get /api/docs', 'text/html: this document as a page'],
]);

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

  it('declares the JSON answer of every operation that has one', async () => {
    const res = await request(t.app).get('/api/openapi.json');
    const doc = openApiDocumentSchema.parse(res.body);
    const withoutSchema: string[] = [];
    const withSchema: string[] = [];
    for (const [path, ops] of Object.entries(doc.paths)) {
      for (const [method, op] of Object.entries(ops)) {
        const success = Object.entries(op!.responses).find(([status]) => status !== 'default');
        expect(success, `${method} ${path} documents its success status`).toBeDefined();
        const schema = success![1].content?.['application/json']?.schema;
        (schema ? withSchema : withoutSchema).push(`${method} ${path}`);
      }
    }
    // Exactly the allow-list answers without a schema: no JSON route forgot one, and no listed
    // route gained one (then it belongs off the list).
    expect(withoutSchema.sort()).toEqual([...NOT_JSON.keys()].sort());
    expect(withSchema.length).toBeGreaterThan(40);

    // Spot checks that the schema is the contract the client parses with.
    const campaign = doc.paths['/api/campaigns/{id}']!.get!.responses['200']!.content!['application/json'].schema;
    expect(Object.keys((campaign.properties as { campaign: { properties: object } }).campaign.properties)).toContain('gridStep');
    const upload = doc.paths['/api/campaigns/{id}/uploads']!.post!.responses['202']!.content!['application/json'].schema;
    expect(upload.required).toEqual(['jobId', 'files', 'entries', 'bytes']);
    // A catalogue import answers 200 when fitted in the request, 202 when the fit became a job.
    const targetImport = doc.paths['/api/campaigns/{id}/targets']!.post!.responses;
    expect(Object.keys(targetImport).sort()).toEqual(['200', '202', 'default']);
    expect(targetImport['202']!.content!['application/json'].schema.required).toContain('photoZJobId');
    const queue = doc.paths['/api/me/queue']!.get!.responses['200']!.content!['application/json'].schema;
    expect(queue.type).toBe('array');
  });

  it('has a page for people', async () => {
    const res = await request(t.app).get('/api/docs');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/html/);
    expect(res.text).toContain('<code>/api/campaigns/{id}/confirmed</code>');
  });
});
