import { copyFileSync, mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { jobs, users } from '../../backend/src/db/schema';
import { receiveUpload } from '../../backend/src/services/receive-upload';
import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import { launchBrowser, signInThroughPage, startE2eServer, waitForDemoScans, type E2eServer } from './browser';

/*
 * The plot a reader reads at the detection limit: the demo's faint arc LNT-W01 (S/N ≈ 2 per
 * pixel) on the inspection screen and a disagreement on it in the settlement view. Screenshots go
 * to docs/screens/ (committed) and to this test's artefact folder; the label boxes checked are the
 * ones the comb overlay reports it drew (data-label-boxes on its canvas), not a re-computation.
 */

const SCREENS = path.resolve('docs/screens');
const ARTEFACTS = path.resolve('test-results/plot-legibility');

interface DrawnBox {
  comb: number;
  text: string;
  left: number;
  top: number;
  width: number;
  height: number;
}

let server: E2eServer;
let browser: Browser;
let spectrumId: number;

beforeAll(async () => {
  server = await startE2eServer({ demoSpectra: true });
  browser = await launchBrowser();
  // Job 1 scans the Lantern campaign's spectra, the faint arc among them.
  expect(await waitForDemoScans(server, [1])).toEqual(['done']);
  mkdirSync(SCREENS, { recursive: true });
  mkdirSync(ARTEFACTS, { recursive: true });
}, 240_000);
afterAll(async () => {
  await browser?.close();
  await server?.cleanup();
});

/** The label boxes the comb overlay of the plot drew, once the comb has rested and they are written. */
async function drawnBoxes(page: Page, plotName: string): Promise<DrawnBox[]> {
  const canvas = page.getByRole('group', { name: plotName }).locator('canvas[data-label-boxes]');
  await canvas.waitFor({ state: 'attached', timeout: 15_000 });
  return JSON.parse((await canvas.getAttribute('data-label-boxes'))!) as DrawnBox[];
}

/** Pairs of drawn boxes that share any area (touching edges do not count). */
function overlapping(boxes: DrawnBox[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < boxes.length; i++) {
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i]!;
      const b = boxes[j]!;
      if (a.left < b.left + b.width && b.left < a.left + a.width && a.top < b.top + b.height && b.top < a.top + a.height) out.push(`${a.text} × ${b.text}`);
    }
  }
  return out;
}

async function screenshot(page: Page, name: string) {
  await page.screenshot({ path: path.join(ARTEFACTS, name), fullPage: false });
  copyFileSync(path.join(ARTEFACTS, name), path.join(SCREENS, name));
}

it('the inspection screen at S/N ≈ 2: smoothed by default, the class’s lines only, no two labels overlapping, hidden ones on hover', async () => {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1200 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, 'reader1@demo.test');
  const queue: Array<{ id: number; fileName: string }> = await page.evaluate(async () => (await fetch('/api/me/queue?campaign=1')).json());
  const faint = queue.find((q) => q.fileName.startsWith('LNT-W01'));
  expect(faint).toBeDefined();
  spectrumId = faint!.id;
  const detail = await page.evaluate(async (id) => (await fetch(`/api/spectra/${id}`)).json(), spectrumId);
  const top = detail.scan.solutions[0] as { z: number; class: string };
  const { lines } = (await page.evaluate(async () => (await fetch('/api/line-list')).json())) as { lines: Array<{ name: string; strengthByClass: Record<string, number> }> };

  await page.goto(`${server.url}/campaigns/1/inspect?spectrum=${spectrumId}`);
  const plot = page.getByRole('group', { name: 'Spectrum plot' });
  await plot.waitFor({ timeout: 30_000 });
  const trialZ = page.getByRole('textbox', { name: 'Trial redshift' });
  await expect.poll(() => trialZ.inputValue(), { timeout: 30_000 }).toBe(top.z.toFixed(5));

  // Smoothing opens matched to the S/N: median ≈ 2 per pixel → a boxcar of (3/2)² → 3 pixels.
  await expect.poll(() => page.getByLabel('Smoothing', { exact: true }).inputValue()).toBe('boxcar');
  expect(await page.getByLabel('Width', { exact: true }).inputValue()).toBe('3');
  const note = (await page.getByText(/^median S\/N \d\.\d per pixel/).textContent())!;
  const snr = Number(/S\/N (\d\.\d)/.exec(note)![1]);
  expect(snr).toBeGreaterThanOrEqual(1.6);
  expect(snr).toBeLessThan(2.5);

  // The χ² strip says what Δχ² is where it can be read.
  await expect.poll(() => page.getByRole('figure').filter({ hasText: 'Δχ² = χ²(z) − χ² of the best fit' }).count()).toBe(1);

  // Take the top solution; the comb draws the lines of its class only.
  await page.getByRole('button', { name: /^Solution\s*1\s*:/ }).click();
  await page.mouse.move(0, 0);
  await page.waitForTimeout(400);
  const boxes = await drawnBoxes(page, 'Spectrum plot');
  expect(boxes.length).toBeGreaterThan(2);
  expect(overlapping(boxes)).toEqual([]);
  const ofClass = new Set(lines.filter((l) => l.strengthByClass[top.class] !== undefined).map((l) => l.name));
  expect(boxes.filter((b) => !ofClass.has(b.text)).map((b) => b.text)).toEqual([]);
  await screenshot(page, 'inspect-low-sn.png');

  // Every line, at full width: still no overlap; what had no room is listed under the pointer.
  await page.getByLabel(/^All lines/).check();
  await page.waitForTimeout(400);
  const all = await drawnBoxes(page, 'Spectrum plot');
  expect(overlapping(all)).toEqual([]);
  const canvas = plot.locator('canvas[data-label-boxes]');
  const dropped = Number(await canvas.getAttribute('data-dropped-labels'));
  expect(all.length).toBeGreaterThan(boxes.length);
  const area = (await plot.locator('.u-over').boundingBox())!;
  const pointAt = all.find((b) => b.comb === 0)!;
  await page.mouse.move(area.x + pointAt.left + 2, area.y + pointAt.top + 4);
  const tip = plot.locator('[role="tooltip"]');
  await expect.poll(() => tip.textContent()).toContain(pointAt.text);
  if (dropped > 0) {
    // Hover every marker column in turn until one lists a hidden label.
    let sawHidden = false;
    for (let x = 0; x < area.width && !sawHidden; x += 3) {
      await page.mouse.move(area.x + x, area.y + area.height / 2);
      await page.waitForTimeout(20);
      sawHidden = ((await tip.textContent()) ?? '').includes('(label hidden)');
    }
    expect(sawHidden).toBe(true);
  }
  await page.getByLabel(/^All lines/).uncheck();
  expect(pageErrors).toEqual([]);
  await page.close();
}, 120_000);

async function readAs(page: Page, email: string, reading: { z: number; class: string; lines: string[] }) {
  await signInThroughPage(page, server.url, email);
  const status = await page.evaluate(
    async ({ id, reading }) => (await fetch(`/api/spectra/${id}/readings`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ ...reading, grade: 'possible' }) })).status,
    { id: spectrumId, reading },
  );
  expect(status).toBe(200);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);
}

it('the settlement view: each comb draws only its reading’s lines in one row captioned with its z, and no two labels overlap', async () => {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1200 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  const first = { z: 4.372, class: 'lyman-break', lines: ['Ly-alpha', 'Si II 1260', 'C II 1335'] };
  const second = { z: 0.9805, class: 'galaxy', lines: ['[O II] 3727', '[O II] 3730', 'H-beta', '[O III] 4960', '[O III] 5008'] };
  await readAs(page, 'reader1@demo.test', first);
  await readAs(page, 'reader2@demo.test', second);

  await signInThroughPage(page, server.url, 'lead@demo.test');
  await page.goto(`${server.url}/campaigns/1/disagreements`);
  await page.getByRole('navigation', { name: 'Open disagreements' }).getByRole('link', { name: /LNT-W01/ }).click();
  const plotName = "Spectrum with both readings' combs";
  await page.getByRole('group', { name: plotName }).waitFor({ timeout: 15_000 });
  await page.waitForTimeout(400);
  const boxes = await drawnBoxes(page, plotName);
  expect(overlapping(boxes)).toEqual([]);
  // One row per comb: the first along the top, the second along the bottom, each with its caption.
  const rowsOf = (comb: number) => new Set(boxes.filter((b) => b.comb === comb).map((b) => b.top));
  expect(rowsOf(0).size).toBe(1);
  expect(rowsOf(1).size).toBe(1);
  expect([...rowsOf(0)][0]!).toBeLessThan([...rowsOf(1)][0]!);
  const texts = (comb: number) => boxes.filter((b) => b.comb === comb).map((b) => b.text);
  expect(texts(0)[0]).toBe('1st z = 4.37200');
  expect(texts(1)[0]).toBe('2nd z = 0.98050');
  // Only the readings' own lines (those in view; a label without room would be listed on hover).
  expect(texts(0).slice(1).every((t) => first.lines.includes(t))).toBe(true);
  expect(texts(1).slice(1).every((t) => second.lines.includes(t))).toBe(true);
  expect(texts(0).length + texts(1).length).toBeGreaterThan(4);
  await screenshot(page, 'settlement.png');
  expect(pageErrors).toEqual([]);
  await page.close();
}, 120_000);

/** An invented galaxy spectrum whose sky column is 40× its continuum, as a text table with a sky column. */
function skyDominatedCsv(): string {
  const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.8, snr: 10, seed: 2031, wavelengthMin: 5000, wavelengthMax: 9500, pixels: 3000 });
  const rows = ['# Invented test spectrum: a galaxy under a bright sky (Redward plot test)', '# medium: vacuum', 'wavelength_angstrom,flux,error,mask,sky'];
  let level = 0;
  for (let i = 0; i < s.flux.length; i++) level = Math.max(level, Math.abs(s.flux[i]!));
  for (let i = 0; i < s.flux.length; i++) {
    const lam = s.wavelength[i]!;
    const night = [5578.9, 6302.0, 7246.0, 7916.0, 8399.0, 8827.0, 9378.0].some((l) => Math.abs(lam - l) < 4) ? 300 : 40;
    const err = s.ivar[i]! > 0 ? 1 / Math.sqrt(s.ivar[i]!) : 0;
    rows.push(`${lam.toFixed(3)},${s.flux[i]!.toPrecision(6)},${err.toPrecision(5)},${s.mask[i]},${(night * level).toPrecision(6)}`);
  }
  return rows.join('\n') + '\n';
}

it('a sky that swamps the data starts hidden and is one click away', async () => {
  const ctx = server.ctx;
  const idOf = (email: string) => ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email)).get()!.id;
  const tempFile = ctx.store.tempPath();
  writeFileSync(tempFile, skyDominatedCsv());
  const lead = { id: idOf('lead@demo.test'), email: 'lead@demo.test', name: 'Lena', isAdmin: false };
  const { jobId } = await receiveUpload(ctx, ctx.store, lead, 1, [{ originalName: 'SKYTEST-1.csv', tempFile }], { assign: { first: idOf('reader1@demo.test'), second: idOf('reader2@demo.test') } });
  ctx.wakeJobRunner();
  for (let i = 0; i < 600 && ctx.db.select({ state: jobs.state }).from(jobs).where(eq(jobs.id, jobId)).get()!.state !== 'done'; i++) await new Promise((r) => setTimeout(r, 100));

  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, 'reader1@demo.test');
  const queue: Array<{ id: number; fileName: string }> = await page.evaluate(async () => (await fetch('/api/me/queue?campaign=1')).json());
  const sky = queue.find((q) => q.fileName === 'SKYTEST-1.csv');
  expect(sky).toBeDefined();
  await page.goto(`${server.url}/campaigns/1/inspect?spectrum=${sky!.id}`);
  await page.getByRole('group', { name: 'Spectrum plot' }).waitFor({ timeout: 30_000 });
  const skyBox = page.getByLabel(/^Sky/);
  await skyBox.waitFor({ timeout: 15_000 });
  expect(await skyBox.isChecked()).toBe(false);
  expect(await page.getByText('(swamps the data: hidden at first)').count()).toBe(1);
  const legend = page.getByRole('list', { name: 'Plot legend' });
  expect(await legend.textContent()).not.toMatch(/\bsky\b/);
  // At S/N 10 per pixel the spectrum opens unsmoothed.
  expect(await page.getByLabel('Smoothing', { exact: true }).inputValue()).toBe('none');
  await skyBox.check();
  await expect.poll(() => legend.textContent()).toMatch(/\bsky\b/);
  expect(pageErrors).toEqual([]);
  await page.close();
}, 120_000);
