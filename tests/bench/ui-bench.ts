import { writeFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { eq } from 'drizzle-orm';
import { chromium } from 'playwright-core';
import { jobs } from '../../backend/src/db/schema';
import { spectrumToCsv } from '../../backend/src/demo/spectrum-files';
import { receiveUpload } from '../../backend/src/services/receive-upload';
import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import { CHROMIUM_PATH, signInThroughPage, startE2eServer } from '../e2e/browser';
import { buildFrontendIfStale } from '../../backend/src/cli/frontend-build';
import { userIdOf } from '../helpers/assigned-spectra';

/**
 * `npm run bench:ui`: the inspection screen measured in Chromium on two 100,000-pixel spectra.
 * - dragFrameMsMedian: from a pointer move while dragging the comb to the next animation frame
 *   (vsync and frame-rate limit off, so this is the work per move, not the display's 16.7 ms);
 * - nextSpectrumMs: from pressing "next spectrum" (prefetched) to the next spectrum's trial z
 *   shown and a frame painted;
 * - initialJsGzipKb: all JavaScript loaded to open the inspection route, gzipped.
 * Prints a line per figure, then the figures as JSON on the last line.
 */
const PIXELS = 100_000;

await buildFrontendIfStale(() => {});
const server = await startE2eServer();
const browser = await chromium.launch({
  executablePath: CHROMIUM_PATH,
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-gpu-vsync', '--disable-frame-rate-limit'],
});
try {
  const t = { ctx: server.ctx } as Parameters<typeof userIdOf>[0];
  const lead = { id: userIdOf(t, 'lead@demo.test'), email: 'lead@demo.test', name: 'Lena', isAdmin: false };
  const files = [0, 1].map((i) => {
    const s = generateSyntheticSpectrum({ class: 'galaxy', z: 0.8 + 0.3 * i, snr: 8, seed: 77 + i, pixels: PIXELS, wavelengthMin: 3600, wavelengthMax: 10000 });
    const tempFile = server.ctx.store.tempPath();
    writeFileSync(tempFile, spectrumToCsv(s));
    return { originalName: `UIBENCH-${i + 1}.csv`, tempFile };
  });
  const { jobId } = await receiveUpload(server.ctx, server.ctx.store, lead, 1, files, { assign: { first: userIdOf(t, 'reader1@demo.test'), second: userIdOf(t, 'reader2@demo.test') } });
  server.ctx.wakeJobRunner();
  while (server.ctx.db.select().from(jobs).where(eq(jobs.id, jobId)).get()!.state !== 'done') await new Promise((r) => setTimeout(r, 200));

  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  await signInThroughPage(page, server.url, 'reader1@demo.test');
  const scripts = new Map<string, Buffer>();
  page.on('response', async (res) => {
    if (res.request().resourceType() === 'script') scripts.set(res.url(), await res.body().catch(() => Buffer.alloc(0)));
  });
  await page.goto(`${server.url}/campaigns/1/inspect`);
  const plot = page.getByRole('group', { name: 'Spectrum plot' });
  const trialZ = page.getByRole('textbox', { name: 'Trial redshift' });
  await plot.waitFor();
  while (!/^\d+\.\d{5}$/.test(await trialZ.inputValue())) await page.waitForTimeout(50);
  await page.waitForTimeout(1500);
  const initialJsGzipKb = [...scripts.values()].reduce((sum, b) => sum + gzipSync(b).length, 0) / 1024;
  const scriptSizes = [...scripts.entries()].map(([url, b]) => `${url.split('/').pop()} ${(gzipSync(b).length / 1024).toFixed(1)} kB`).sort();

  // The driver's own cost: a pointer move over the page header and one frame, no drag.
  const idle: number[] = [];
  for (let i = 1; i <= 40; i++) {
    const start = performance.now();
    await page.mouse.move(20 + i, 10);
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
    idle.push(performance.now() - start);
  }
  idle.sort((a, b) => a - b);
  const driverMsMedian = idle[idle.length >> 1]!;

  // Dragging the comb.
  const area = (await plot.locator('.u-over').first().boundingBox())!;
  const y = area.y + area.height / 2;
  const x0 = area.x + area.width * 0.3;
  await page.mouse.move(x0, y);
  await page.mouse.down();
  const frames: number[] = [];
  for (let i = 1; i <= 80; i++) {
    const start = performance.now();
    await page.mouse.move(x0 + i * 4, y);
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
    frames.push(performance.now() - start);
  }
  await page.mouse.up();
  frames.sort((a, b) => a - b);
  const dragFrameMsMedian = frames[frames.length >> 1]!;

  // Moving on to the prefetched next spectrum.
  const queue = await page.evaluate(async () => (await fetch('/api/me/queue?campaign=1')).json());
  const nextDetail = await page.evaluate(async (id) => (await fetch(`/api/spectra/${id}`)).json(), queue[1].id);
  const nextZ = (nextDetail.scan.solutions[0].z as number).toFixed(5);
  await page.waitForTimeout(2000);
  await page.locator('body').focus();
  const start = performance.now();
  await page.keyboard.press(']');
  while ((await trialZ.inputValue()) !== nextZ) await page.waitForTimeout(5);
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
  const nextSpectrumMs = performance.now() - start;

  const result = {
    pixels: PIXELS,
    dragFrameMsMedian: Number(dragFrameMsMedian.toFixed(2)),
    dragFrameMsP90: Number(frames[Math.floor(frames.length * 0.9)]!.toFixed(2)),
    driverMsMedian: Number(driverMsMedian.toFixed(2)),
    nextSpectrumMs: Number(nextSpectrumMs.toFixed(1)),
    initialJsGzipKb: Number(initialJsGzipKb.toFixed(1)),
    note: 'times include the CDP round trip of the test driver; load on the machine inflates them',
  };
  console.log(`drag: median ${result.dragFrameMsMedian} ms per move to next frame (p90 ${result.dragFrameMsP90} ms) on ${PIXELS} pixels; the same without a drag: ${result.driverMsMedian} ms`);
  console.log(`next spectrum (prefetched): ${result.nextSpectrumMs} ms to its trial z shown and painted`);
  console.log(`initial JavaScript of the inspection route: ${result.initialJsGzipKb} kB gzipped (${scriptSizes.join(', ')})`);
  console.log(JSON.stringify(result));
} finally {
  await browser.close();
  await server.cleanup();
}
