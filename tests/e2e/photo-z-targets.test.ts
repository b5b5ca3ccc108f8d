import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { demoCatalogueCsv, demoSource } from '../helpers/demo-catalogue';
import { spectrumToCsv } from '../../backend/src/demo/spectrum-files';
import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
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

// Invented: a z = 6.2 dropout with Lyα, and a z = 1.3 old dusty galaxy.
const SOURCES = [demoSource('E2E-DROP-1', { class: 'lyman-break', template: 'lyman-break-lya', z: 6.2, snr: 6 }, 25.6), demoSource('E2E-LOWZ-1', { class: 'galaxy', template: 'galaxy-absorption', z: 1.3, snr: 6 }, 24.6)];


it('a lead imports a catalogue with fluxes, sees the P(z) and SED of a dropout, opens its spectrum and sees P(z) on the χ²(z) strip', async () => {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, 'lead@demo.test');

  // Import: the flux_/err_ columns are proposed as nJy bands of the shipped filters.
  await page.goto(`${server.url}/campaigns/2/targets`);
  await page.getByLabel('Choose a catalogue').setInputFiles({ name: 'tidewater-photometry.csv', mimeType: 'text/csv', buffer: Buffer.from(demoCatalogueCsv(SOURCES, 2026)) });
  const bands = page.getByRole('group', { name: /^Band \d+$/ });
  await expect.poll(() => bands.count(), { timeout: 15_000 }).toBe(10);
  await expect(bands.first().getByLabel('Filter').inputValue()).resolves.toBe('acs_wfc_f435w');
  await page.getByRole('button', { name: 'Import targets' }).click();
  await expect.poll(() => page.locator('dl[aria-label="Catalogue import result"]').textContent(), { timeout: 30_000 }).toMatch(/Created\s*2/);

  // The spectrum of the dropout, linked by the id in its file name and scanned.
  await page.goto(`${server.url}/campaigns/2/upload`);
  const spectrum = generateSyntheticSpectrum({ class: 'lyman-break', template: 'lyman-break-lya', z: 6.2, snr: 8, seed: 77, wavelengthMin: 5500, wavelengthMax: 10000, pixels: 4000 });
  await page.getByLabel('Choose files').setInputFiles({ name: 'E2E-DROP-1_grism.csv', mimeType: 'text/csv', buffer: Buffer.from(spectrumToCsv(spectrum, 'synthetic dropout, invented')) });
  await page.getByRole('button', { name: 'Upload', exact: true }).click();
  const scan = page.getByRole('progressbar', { name: 'Scan progress' });
  await scan.waitFor({ timeout: 30_000 });
  await expect.poll(() => scan.getAttribute('aria-valuenow'), { timeout: 90_000 }).toBe('1');

  // The targets table: computed z, its interval and the interloper odds; the dropout group filter.
  await page.goto(`${server.url}/campaigns/2/targets`);
  const table = page.getByRole('table', { name: 'Targets' });
  const dropRow = table.getByRole('row').filter({ hasText: 'E2E-DROP-1' });
  await expect.poll(() => dropRow.textContent(), { timeout: 15_000 }).toMatch(/6\.\d\d \(\d\.\d\d–\d\.\d\d\).*< 0\.1 %.*galaxy/);
  await page.getByLabel('Photometric redshift').selectOption('dropout');
  await expect.poll(() => table.getByRole('row').count()).toBe(2); // header + the dropout
  await page.getByLabel('Photometric redshift').selectOption('interloper');
  await expect.poll(() => table.getByRole('row').filter({ hasText: 'E2E-LOWZ-1' }).count()).toBe(1);
  await page.getByLabel('Photometric redshift').selectOption('all');

  // Its P(z) and SED: blue bands are upper limits, the best galaxy is drawn through the bands.
  await dropRow.getByRole('button', { name: 'E2E-DROP-1' }).click();
  const panel = page.getByRole('region', { name: 'Photometry of E2E-DROP-1' });
  const pz = panel.getByRole('img', { name: /^P\(z\) of E2E-DROP-1: best z 6\.\d\d, 95 % interval/ });
  await pz.waitFor({ timeout: 15_000 });
  const bestZ = Number(/best z (\d+\.\d+)/.exec((await pz.getAttribute('aria-label'))!)![1]);
  expect(Math.abs(bestZ - 6.2) / 7.2).toBeLessThan(0.05);
  const sed = panel.getByRole('img', { name: /^Spectral energy distribution of E2E-DROP-1: 10 bands, [2-9] upper limits$/ });
  await sed.waitFor();
  expect(await sed.locator('[data-limit="true"][data-band="acs_wfc_f435w"]').count()).toBe(1);
  expect(await sed.locator('path.stroke-ember-500').count()).toBe(1);
  expect(await panel.textContent()).toMatch(/Solid: best galaxy lbg-/);

  // Open its spectrum: the χ²(z) strip carries the photometric P(z) layer and its notice.
  await panel.getByRole('link', { name: 'E2E-DROP-1_grism.csv' }).click();
  await page.waitForURL(/\/spectra\/\d+$/);
  const layer = page.locator('canvas[data-layer="photo-z-posterior"][data-drawn="true"]');
  await layer.waitFor({ state: 'attached', timeout: 30_000 });
  const painted = await layer.evaluate((c: HTMLCanvasElement) => {
    const d = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
    let n = 0;
    for (let i = 3; i < d.length; i += 4) if (d[i]! > 0) n++;
    return n;
  });
  expect(painted).toBeGreaterThan(200);
  const trialZ = page.getByRole('textbox', { name: 'Trial redshift' });
  await expect.poll(() => trialZ.inputValue(), { timeout: 30_000 }).toMatch(/^6\.\d{5}$/);
  await expect.poll(() => page.getByText(/P\(z\) from the catalogue photometry .* contains the trial z\./).count()).toBe(1);
  // A trial z at the interloper's redshift is outside the 95 % interval: the notice says so.
  await trialZ.fill('1.30000');
  await trialZ.press('Enter');
  await expect.poll(() => page.getByText(/The trial z lies outside the photometric 95 % interval/).count()).toBe(1);
  expect(pageErrors).toEqual([]);
}, 240_000);
