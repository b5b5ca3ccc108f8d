import { afterAll, beforeAll, expect, it } from 'vitest';
import { lineListResponseSchema } from '../../backend/src/contracts/line-list';
import { signInDemoMembers, type Agent } from '../helpers/assigned-spectra';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let reader1: Agent;

beforeAll(async () => {
  t = await createTestApp();
  ({ reader1 } = await signInDemoMembers(t));
}, 60_000);
afterAll(() => t.cleanup());

it('serves each comb line with the classes whose templates draw it and the templates that move it off systemic', async () => {
  const res = await reader1.get('/api/line-list');
  expect(res.status).toBe(200);
  const { lines } = lineListResponseSchema.parse(res.body);
  const byName = new Map(lines.map((l) => [l.name, l]));
  expect(byName.get('Ly-alpha')).toMatchObject({ strengthByClass: { quasar: 1, 'lyman-break': 1 }, offsets: [{ template: 'lyman-break-lya', velocityKms: 300 }] });
  expect(Object.keys(byName.get('CaH 6385')!.strengthByClass)).toEqual(['star']);
  expect(byName.get('Ly-delta')!.strengthByClass).toEqual({});
  // Every class has lines of its own on the comb.
  for (const cls of ['galaxy', 'quasar', 'star', 'lyman-break'] as const) expect(lines.filter((l) => l.strengthByClass[cls] !== undefined).length).toBeGreaterThan(5);
});
