import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { loadShippedFilters } from '../../backend/src/cli/photoz-data';
import { loadConfig } from '../../backend/src/config';
import { jobs, photoZFits, targets } from '../../backend/src/db/schema';
import { DEMO_BANDS, demoFluxes } from '../../backend/src/demo/demo-photometry';
import { demoCatalogueCsv, type DemoTarget } from '../../backend/src/demo/demo-scenario';
import { startServer, type RunningServer } from '../../backend/src/server';
import { startRedis, type TestRedis } from '../helpers/redis-server';

// With the Redis queue, remote workers only scan spectra: the server fits a photo-z job itself.
// No worker process runs here at all.
let redis: TestRedis;
let server: RunningServer;
let dataDir: string;

beforeAll(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), 'redward-photoz-redis-'));
  redis = await startRedis();
  server = await startServer(
    loadConfig({ DATA_DIR: dataDir, PORT: '0', HOST: '127.0.0.1', LOG_LEVEL: 'silent', MAIL_CATCHER_PORT: '0', REDWARD_DEMO_SPECTRA: '0', JOB_QUEUE: redis.url, SCAN_THREADS: '1', PHOTOZ_JOB_THRESHOLD: '2' }),
  );
}, 60_000);
afterAll(async () => {
  await server?.close();
  await redis?.stop();
  rmSync(dataDir, { recursive: true, force: true });
});

const FILTERS = DEMO_BANDS.map((b) => b.filter);
// Invented: a z = 6.2 Lyman-break galaxy, a z = 1.3 old dusty interloper, a cool dwarf.
const SOURCES: DemoTarget[] = [
  { id: 'RQ-DROP-1', ra: 160.5, dec: -11.6, mag: 25.5, truth: { class: 'lyman-break', template: 'lyman-break', z: 6.2, snr: 5 }, photoZ: 1, priority: 1, instrument: 'demo-grism' },
  { id: 'RQ-LOWZ-1', ra: 160.5, dec: -11.6, mag: 24.5, truth: { class: 'galaxy', template: 'galaxy-absorption', z: 1.3, snr: 5 }, photoZ: 1, priority: 1, instrument: 'demo-grism' },
  { id: 'RQ-STAR-1', ra: 160.5, dec: -11.6, mag: 24.5, truth: { class: 'star', template: 'star-cool', z: 0, snr: 5 }, photoZ: 1, priority: 1, instrument: 'demo-grism' },
];

it('fits a large import’s photo-z on the server under JOB_QUEUE=redis://, without any scan worker', { timeout: 60_000 }, async () => {
  const login = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: 'lead@demo.test', password: 'redward-demo' }) });
  const headers = { cookie: login.headers.get('set-cookie')!.split(';')[0]!, origin: server.url };
  const form = new FormData();
  form.append('files', new Blob([demoCatalogueCsv(SOURCES, { filters: FILTERS, fluxes: demoFluxes(SOURCES, loadShippedFilters(FILTERS), 3) })]), 'targets.csv');
  const res = await fetch(`${server.url}/api/campaigns/1/targets`, { method: 'POST', headers, body: form });
  const body = (await res.json()) as { photoZJobId: number; created: number };
  expect(res.status, JSON.stringify(body)).toBe(202);
  expect(body.created).toBe(3);
  const db = server.ctx.db;
  for (let i = 0; i < 300; i++) {
    if (db.select({ state: jobs.state }).from(jobs).where(eq(jobs.id, body.photoZJobId)).get()!.state === 'done') break;
    await new Promise((r) => setTimeout(r, 100));
  }
  expect(db.select().from(jobs).where(eq(jobs.id, body.photoZJobId)).get()).toMatchObject({ kind: 'photoz', state: 'done', done: 1, total: 1 });
  const drop = db.select({ id: targets.id }).from(targets).where(eq(targets.catalogueId, 'RQ-DROP-1')).get()!;
  const fit = db.select().from(photoZFits).where(eq(photoZFits.targetId, drop.id)).get()!;
  expect(fit.z95Low).toBeLessThanOrEqual(6.2);
  expect(fit.z95High).toBeGreaterThanOrEqual(6.2);
  expect(db.select().from(photoZFits).all()).toHaveLength(3);
});
