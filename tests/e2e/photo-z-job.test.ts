import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { demoCatalogueCsv, demoSource } from '../helpers/demo-catalogue';
import { launchBrowser, signInThroughPage, startE2eServer, type E2eServer } from './browser';

let server: E2eServer;
let browser: Browser;

beforeAll(async () => {
  // Above one row with photometry the import fits its photo-z in a job (the default is 2,000 rows).
  server = await startE2eServer({ env: { PHOTOZ_JOB_THRESHOLD: '1' } });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.cleanup();
});

// Invented: a z = 6.2 dropout with Lyα, a z = 1.3 old dusty galaxy and a cool dwarf.
const SOURCES = [
  demoSource('JOB-DROP-1', { class: 'lyman-break', template: 'lyman-break-lya', z: 6.2, snr: 6 }, 25.6),
  demoSource('JOB-LOWZ-1', { class: 'galaxy', template: 'galaxy-absorption', z: 1.3, snr: 6 }, 24.6),
  demoSource('JOB-STAR-1', { class: 'star', template: 'star-cool', z: 0, snr: 6 }, 24.6),
];


it('a large catalogue import shows its photo-z job on the Targets screen, then the computed z in the table', async () => {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, 'lead@demo.test');

  await page.goto(`${server.url}/campaigns/2/targets`);
  await page.getByLabel('Choose a catalogue').setInputFiles({ name: 'large.csv', mimeType: 'text/csv', buffer: Buffer.from(demoCatalogueCsv(SOURCES, 2027)) });
  await expect.poll(() => page.getByRole('group', { name: /^Band \d+$/ }).count(), { timeout: 15_000 }).toBe(10);
  await page.getByRole('button', { name: 'Import targets' }).click();
  await expect.poll(() => page.locator('dl[aria-label="Catalogue import result"]').textContent(), { timeout: 30_000 }).toMatch(/Created\s*3/);

  const bar = page.getByRole('progressbar', { name: /^Photometric redshifts \(job \d+\)$/ });
  await bar.waitFor({ timeout: 15_000 });
  expect(await bar.getAttribute('aria-valuemax')).toBe('1');
  await expect.poll(() => bar.getAttribute('aria-valuenow'), { timeout: 60_000 }).toBe('1');
  await page.getByRole('status').filter({ hasText: 'Every photometric redshift is computed' }).waitFor({ timeout: 15_000 });

  // The table refetched when the job ended: the dropout's computed z with its interval.
  const table = page.getByRole('table', { name: 'Targets' });
  const dropRow = table.getByRole('row').filter({ hasText: 'JOB-DROP-1' });
  await expect.poll(() => dropRow.textContent(), { timeout: 15_000 }).toMatch(/6\.\d\d \(\d\.\d\d–\d\.\d\d\).*< 0\.1 %.*galaxy/);
  expect(pageErrors).toEqual([]);
  await page.close();
}, 180_000);
