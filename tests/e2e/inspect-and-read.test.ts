import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { launchBrowser, signInThroughPage, startE2eServer, waitForDemoScans, type E2eServer } from './browser';

const axePath = createRequire(import.meta.url).resolve('axe-core/axe.min.js');

let server: E2eServer;
let browser: Browser;

beforeAll(async () => {
  // The demo campaigns with their 120 synthetic spectra, assigned to both demo readers.
  server = await startE2eServer({ demoSpectra: true });
  browser = await launchBrowser();
  // Both demo campaigns are scanned; the Lantern one (job 1) is the one these screens read.
  expect((await waitForDemoScans(server, [1, 2], 120_000))[0]).toBe('done');
}, 180_000);
afterAll(async () => {
  await browser?.close();
  await server?.cleanup();
});

it('a reader drags the comb, snaps to the top solution and saves a graded reading from the keyboard', async () => {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, 'reader1@demo.test');
  await page.goto(`${server.url}/campaigns/1/inspect`);

  const plot = page.getByRole('group', { name: 'Spectrum plot' });
  const trialZ = page.getByRole('textbox', { name: 'Trial redshift' });
  await plot.waitFor({ timeout: 30_000 });
  await expect.poll(() => trialZ.inputValue(), { timeout: 30_000 }).toMatch(/^\d+\.\d{5}$/);
  // The queue opens at its first item.
  const queue = await page.evaluate(async () => (await fetch('/api/me/queue?campaign=1')).json());
  const spectrumId: number = queue[0].id;
  const currentId = () => Number(new URL(page.url()).searchParams.get('spectrum') ?? spectrumId);

  // The best-fit template of the top solution is drawn over the data (its legend entry appears with it).
  await expect.poll(() => page.getByRole('list', { name: 'Plot legend' }).textContent(), { timeout: 15_000 }).toContain('template of the solution');

  // Drag across the plotting area with the comb tool: the trial redshift follows.
  const before = await trialZ.inputValue();
  const area = await plot.locator('.u-over').first().boundingBox();
  expect(area).not.toBeNull();
  const y = area!.y + area!.height / 2;
  await page.mouse.move(area!.x + area!.width * 0.4, y);
  await page.mouse.down();
  for (let dx = 10; dx <= 120; dx += 10) await page.mouse.move(area!.x + area!.width * 0.4 + dx, y);
  await page.mouse.up();
  await expect.poll(() => trialZ.inputValue()).not.toBe(before);

  // Smoothing width in pixels or km/s: switching unit carries the width over at the spectrum's median pixel.
  await page.getByLabel('Smoothing', { exact: true }).selectOption('gaussian');
  const width = page.getByLabel('Width', { exact: true });
  await expect.poll(() => width.inputValue()).toBe('5');
  const equivalent = page.getByText(/^≈ \d+ km\/s$/);
  const kmsForFive = Number(/\d+/.exec((await equivalent.textContent())!)![0]);
  expect(kmsForFive).toBeGreaterThan(5);
  await page.getByLabel('Unit', { exact: true }).selectOption('km/s');
  await expect.poll(() => width.inputValue()).toBe(String(kmsForFive));
  await expect(page.getByText(/^≈ \d+\.\d px$/).textContent()).resolves.toMatch(/^≈ (4\.\d|5\.0) px$/);
  await page.getByLabel('Unit', { exact: true }).selectOption('pixels');
  await expect.poll(() => width.inputValue()).toBe('5');

  // Snapping to the top solution sets the trial redshift to its z.
  const detail = await page.evaluate(async (id) => (await fetch(`/api/spectra/${id}`)).json(), spectrumId);
  const topZ: number = detail.scan.solutions[0].z;
  // The top solution shows its fit's χ² per degree of freedom, as the scan stored it.
  const top = page.getByRole('button', { name: /^Solution\s*1\s*:/ });
  await expect.poll(() => top.textContent()).toContain(`χ²/dof ${detail.scan.solutions[0].reducedChi2.toFixed(2)}`);
  // Every solution of a class with line offsets (Lyman-break galaxies, quasars) shows its systematic error beside zErr; the others show none.
  const solutions: Array<{ zSysErr?: number }> = detail.scan.solutions;
  const withSys = solutions.filter((s) => s.zSysErr !== undefined).length;
  await expect.poll(async () => (await page.getByRole('button', { name: /^Solution\s*\d+\s*:/ }).allTextContents()).filter((t) => / sys/.test(t)).length).toBe(withSys);
  await top.click();
  await expect.poll(() => trialZ.inputValue()).toBe(topZ.toFixed(5));

  // Keyboard only: leave the button, give the first grade (sure) with Shift + 1 — it saves and moves on.
  await page.keyboard.press('Escape');
  await page.locator('body').focus();
  await page.keyboard.press('Shift+Digit1');
  await expect.poll(currentId, { timeout: 15_000 }).not.toBe(spectrumId);
  expect(currentId()).toBe(queue[1].id);
  // The screen stays mounted, but the comb starts afresh on the next spectrum's top solution; view settings carry over.
  const nextDetail = await page.evaluate(async (id) => (await fetch(`/api/spectra/${id}`)).json(), queue[1].id);
  await expect.poll(() => trialZ.inputValue()).toBe((nextDetail.scan.solutions[0].z as number).toFixed(5));
  await expect.poll(() => page.getByLabel('Smoothing', { exact: true }).inputValue()).toBe('gaussian');
  await expect.poll(() => page.getByRole('status').allTextContents()).toContainEqual(expect.stringMatching(/^Saved .*grade sure,/));

  const saved = await page.evaluate(async (id) => (await fetch(`/api/spectra/${id}`)).json(), spectrumId);
  expect(saved.readings).toHaveLength(1);
  expect(saved.readings[0]).toMatchObject({ grade: 'sure', readingOrder: 'first' });
  expect(saved.readings[0].z).toBeCloseTo(topZ, 5);
  expect(pageErrors).toEqual([]);
});

it('has no serious or critical accessibility violations on the inspection screen (axe-core)', async () => {
  // CSP is bypassed only so the test can inject axe-core's script into the page.
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 }, bypassCSP: true });
  await signInThroughPage(page, server.url, 'reader2@demo.test');
  await page.goto(`${server.url}/campaigns/1/inspect`);
  await page.getByRole('group', { name: 'Spectrum plot' }).waitFor({ timeout: 30_000 });
  await expect.poll(() => page.getByRole('textbox', { name: 'Trial redshift' }).inputValue(), { timeout: 30_000 }).toMatch(/^\d+\.\d{5}$/);
  await page.addScriptTag({ content: readFileSync(axePath, 'utf8') });
  const result = await page.evaluate(async () => (window as unknown as { axe: { run(d: Document): Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }> } }).axe.run(document));
  const serious = result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.impact} ${v.id}: ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(' | ')}`);
  expect(serious).toEqual([]);
});
