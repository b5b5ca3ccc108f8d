import express, { Router } from 'express';
import { pino } from 'pino';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { access } from '../../backend/src/http/access';
import { defineRoute, validateResponses } from '../../backend/src/http/define-route';
import { errorMiddleware } from '../../backend/src/http/error-middleware';
import type { ServiceContext } from '../../backend/src/services/context';

const answerSchema = z.object({ id: z.number().int(), name: z.string() });

/** A bare application with four public routes; the context is only the key of its settings. */
function appWith(validated: boolean) {
  const ctx = {} as ServiceContext;
  if (validated) validateResponses(ctx);
  const router = Router();
  const route = (path: string, answer: unknown, response?: z.ZodType) =>
    defineRoute(ctx, router, { method: 'get', path, access: access.public, ...(response ? { response } : {}), handle: () => answer });
  route('/good', { id: 7, name: 'Hα' }, answerSchema);
  route('/wrong-type', { id: '7', name: 'Hα' }, answerSchema);
  route('/extra-field', { id: 7, name: 'Hα', reader: { id: 2 } }, answerSchema);
  route('/no-schema', { id: 7 });
  route('/empty', undefined, answerSchema);
  const app = express();
  app.use(router);
  app.use(errorMiddleware(pino({ level: 'silent' })));
  return app;
}

describe('response validation', () => {
  const checked = appWith(true);

  it('sends an answer that matches its schema unchanged', async () => {
    const res = await request(checked).get('/good');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ id: 7, name: 'Hα' });
  });

  it('fails an answer that breaks its contract with a 500 naming the route and the field', async () => {
    const res = await request(checked).get('/wrong-type');
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('response_contract_mismatch');
    expect(res.body.error.message).toContain('GET /wrong-type answered JSON that does not match its response schema');
    expect(res.body.error.message).toContain('at id');
  });

  it('fails an answer with fields its schema does not declare', async () => {
    const res = await request(checked).get('/extra-field');
    expect(res.status).toBe(500);
    expect(res.body.error).toEqual({ code: 'response_contract_mismatch', message: 'GET /extra-field answered fields its response schema does not declare: $.reader.' });
  });

  it('fails a JSON answer from a route that declares no schema', async () => {
    const res = await request(checked).get('/no-schema');
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('response_schema_missing');
    expect(res.body.error.message).toContain('GET /no-schema answered JSON but declares no response schema');
  });

  it('leaves 204 answers alone', async () => {
    expect((await request(checked).get('/empty')).status).toBe(204);
  });

  it('checks nothing where it is not turned on (production)', async () => {
    const plain = appWith(false);
    expect((await request(plain).get('/wrong-type')).body).toEqual({ id: '7', name: 'Hα' });
    expect((await request(plain).get('/extra-field')).body).toEqual({ id: 7, name: 'Hα', reader: { id: 2 } });
    expect((await request(plain).get('/no-schema')).body).toEqual({ id: 7 });
  });
});
