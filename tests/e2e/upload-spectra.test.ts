import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { brokenSpectrumFiles, syntheticSpectrumFiles, zip } from '../helpers/spectrum-archives';
import { launchBrowser, signInThroughPage, startE2eServer, type E2eServer } from './browser';

let server: E2eServer;
let browser: Browser;

beforeAll(async () => {
  server = await startE2eServer();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.cleanup();
});


it('a lead imports a catalogue, uploads a zip, watches it scan, and sees the top solutions', async () => {
  const page = await browser.newPage();
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, 'lead@demo.test');

  // The catalogue: ids that appear in the spectra's file names.
  await page.goto(`${server.url}/campaigns/1/targets`);
  const catalogue = ['id,ra,dec,zphot,zphot_l68,zphot_u68', ...Array.from({ length: 12 }, (_, i) => `E2E-${String(i + 1).padStart(4, '0')},160.5,-11.6,1.0,0.8,1.2`)].join('\n');
  await page.getByLabel('Choose a catalogue').setInputFiles({ name: 'targets.csv', mimeType: 'text/csv', buffer: Buffer.from(catalogue) });
  await page.getByRole('button', { name: 'Import targets' }).click();
  await expect.poll(() => page.locator('dl[aria-label="Catalogue import result"]').textContent()).toMatch(/Created\s*12/);

  // The upload: 12 spectra and the three broken files, in one zip.
  await page.goto(`${server.url}/campaigns/1/upload`);
  const archive = zip({ ...syntheticSpectrumFiles(12, { prefix: 'E2E' }), ...brokenSpectrumFiles() });
  await page.getByLabel('Choose files').setInputFiles({ name: 'night-e2e.zip', mimeType: 'application/zip', buffer: archive });
  await page.getByRole('button', { name: 'Upload', exact: true }).click();
  const scan = page.getByRole('progressbar', { name: 'Scan progress' });
  await scan.waitFor({ timeout: 30_000 });
  await expect.poll(() => scan.getAttribute('aria-valuenow'), { timeout: 60_000 }).toBe('15');
  const summary = page.locator('dl[aria-label="Upload summary"]');
  await expect.poll(() => summary.textContent(), { timeout: 30_000 }).toMatch(/Stored\s*12.*Linked\s*12.*Failed\s*3/s);
  // Each file: what happened, its target, its top solution (a link to the spectrum), its readers.
  const files = page.getByRole('table', { name: 'What happened to each file' });
  const emptyRow = files.getByRole('row').filter({ hasText: 'night-e2e.zip/broken/empty.txt' });
  await expect.poll(() => emptyRow.textContent(), { timeout: 30_000 }).toMatch(/failed.*The file is empty\./);
  const firstFile = files.getByRole('row').filter({ hasText: 'E2E-0001.csv' });
  expect(await firstFile.textContent()).toMatch(/stored.*E2E-0001.*by id in the file name.*z = \d\.\d{5}.*0 of 2/);
  expect(await firstFile.getByRole('link', { name: /^z = / }).getAttribute('href')).toMatch(/^\/spectra\/\d+$/);
  // The new spectra go to readers from here (the Assign page's own assignment).
  await page.getByRole('button', { name: 'Assign unassigned spectra' }).click();
  await expect.poll(() => firstFile.textContent(), { timeout: 30_000 }).toMatch(/2 of 2/);

  // The spectra list shows each spectrum's target and top solution.
  await page.goto(`${server.url}/campaigns/1/spectra`);
  const firstRow = page.getByRole('row').filter({ hasText: 'E2E-0001' }).first();
  await firstRow.waitFor();
  expect(await firstRow.textContent()).toMatch(/\d\.\d{5}/);
  expect(pageErrors).toEqual([]);
});
