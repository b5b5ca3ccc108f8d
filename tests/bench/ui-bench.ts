import { writeFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { eq } from 'drizzle-orm';
import { chromium, type Page } from 'playwright-core';
import { jobs } from '../../backend/src/db/schema';
import { spectrumToCsv } from '../../backend/src/demo/spectrum-files';
import { receiveUpload } from '../../backend/src/services/receive-upload';
import { generateSyntheticSpectrum } from '../../backend/src/spectra/generateSyntheticSpectrum';
import { CHROMIUM_PATH, signInThroughPage, startE2eServer } from '../e2e/browser';
import { buildFrontendIfStale } from '../../backend/src/cli/frontend-build';
import { userIdOf } from '../helpers/assigned-spectra';

/**
 * `npm run bench:ui [-- --trace-dir <folder>]`: the inspection screen measured in Chromium on two
 * 100,000-pixel spectra. Vsync and the frame-rate limit are off, so a frame is the work it needs,
 * not the display's 16.7 ms.
 *
 * Measured inside the page (no test-driver round trip in the figure):
 * - drag: pointer moves dispatched on the plotting area while the comb is held (the press is a
 *   real one, so pointer capture is real). Each move is timed from its dispatch to the end of
 *   the frame that shows it: a task posted from the next animation-frame callback runs only
 *   after that frame's style, layout and paint, and after any React work queued before it.
 *   Measured at the top of the page (the feature close-ups are below the fold there and do not
 *   repaint) and again scrolled so the close-ups are in view.
 * - next spectrum: from the "next spectrum" key press to the frame after the new spectrum's trial
 *   z shows and its plot is drawn; the first move is onto the prefetched next spectrum, then the
 *   reader goes back and forth between the two (both cached) for a median.
 * From a Chrome trace of a second drag and one more move: busy time per move of the page's main
 * thread (every task, also those between frames and the harness's own, inflated by the tracing
 * itself) and of the raster tasks (with --disable-gpu, raster is software and off the main thread).
 * The old figures through the test driver (CDP) are kept, labelled cdp…, for comparison.
 * initialJsGzipKb: all JavaScript loaded to open the inspection route, gzipped.
 * Prints a line per figure, then the figures as JSON on the last line.
 */
const PIXELS = 100_000;
const DRAG_MOVES = 120;
const SWITCHES = 6;
const TRACE_CATEGORIES = ['toplevel', 'devtools.timeline', 'disabled-by-default-devtools.timeline', 'cc', 'blink'];
const traceDir = (() => {
  const i = process.argv.indexOf('--trace-dir');
  return i > 0 ? process.argv[i + 1] : undefined;
})();

const median = (v: number[]) => [...v].sort((a, b) => a - b)[v.length >> 1]!;
const p90 = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length * 0.9)]!;
const round = (v: number, d = 2) => Number(v.toFixed(d));

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
  // tsx keeps function names with a helper (__name) that the functions sent into the page call.
  await page.addInitScript({ content: 'globalThis.__name = (f) => f;' });
  await signInThroughPage(page, server.url, 'reader1@demo.test');
  const scripts = new Map<string, Buffer>();
  page.on('response', async (res) => {
    if (res.request().resourceType() === 'script') scripts.set(res.url(), await res.body().catch(() => Buffer.alloc(0)));
  });
  const apiCalls: string[] = [];
  page.on('request', (req) => {
    if (req.url().includes('/api/')) apiCalls.push(new URL(req.url()).pathname);
  });
  await page.goto(`${server.url}/campaigns/1/inspect`);
  const plot = page.getByRole('group', { name: 'Spectrum plot' });
  const trialZ = page.getByRole('textbox', { name: 'Trial redshift' });
  await plot.waitFor();
  while (!/^\d+\.\d{5}$/.test(await trialZ.inputValue())) await page.waitForTimeout(50);
  await page.waitForTimeout(1500);
  const initialJsGzipKb = [...scripts.values()].reduce((sum, b) => sum + gzipSync(b).length, 0) / 1024;
  const scriptSizes = [...scripts.entries()].map(([url, b]) => `${url.split('/').pop()} ${(gzipSync(b).length / 1024).toFixed(1)} kB`).sort();

  const queue: Array<{ id: number }> = await page.evaluate(async () => (await fetch('/api/me/queue?campaign=1')).json());
  const zOf = async (id: number) => ((await page.evaluate(async (i) => (await fetch(`/api/spectra/${i}`)).json(), id)).scan.solutions[0].z as number).toFixed(5);
  const firstZ = await zOf(queue[0]!.id);
  const nextZ = await zOf(queue[1]!.id);

  // In the page: the comb held down by a real press, moves dispatched there, each timed to the end of its frame.
  const drag = await inPageDrag(page, DRAG_MOVES);
  const dragFrames = drag.frames;
  // The same with the page scrolled so the feature close-ups are in view too (below the fold at the top,
  // where they do not repaint): plot, χ² strip and close-ups all follow the comb.
  await page.evaluate(() => window.scrollTo(0, 300));
  // Close-ups of features outside the data stay mounted but hidden (no box): not counted.
  const inView = await page.evaluate(() =>
    [...document.querySelectorAll('canvas[role="img"]')].filter((c) => {
      const r = c.getBoundingClientRect();
      return r.height > 0 && r.top < innerHeight && r.bottom > 0;
    }).length,
  );
  const dragWithPanels = await inPageDrag(page, DRAG_MOVES);
  await page.evaluate(() => window.scrollTo(0, 0));

  // Through the driver (the old figure): CDP pointer moves, each followed by a round trip for one frame.
  const cdpIdle: number[] = [];
  for (let i = 1; i <= 40; i++) {
    const start = performance.now();
    await page.mouse.move(20 + i, 10);
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
    cdpIdle.push(performance.now() - start);
  }
  const area = (await plot.locator('.u-over').first().boundingBox())!;
  const y = area.y + area.height / 2;
  const x0 = area.x + area.width * 0.3;
  await page.mouse.move(x0, y);
  await page.mouse.down();
  const cdpFrames: number[] = [];
  for (let i = 1; i <= 80; i++) {
    const start = performance.now();
    await page.mouse.move(x0 + i * 4, y);
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
    cdpFrames.push(performance.now() - start);
  }
  await page.mouse.up();

  // A traced drag: where the time goes per move (main thread, raster workers).
  await browser.startTracing(page, { categories: TRACE_CATEGORIES });
  await inPageDrag(page, 60);
  const dragTrace = summariseTrace(await browser.stopTracing(), 60, traceDir && `${traceDir}/drag.json`);
  if (traceDir) await profile(page, `${traceDir}/drag.cpuprofile`, () => inPageDrag(page, 60));

  // Moving on to the prefetched next spectrum, timed in the page from the key press.
  await page.waitForTimeout(1500);
  const callsBefore = apiCalls.length;
  const nextSpectrumMs = await inPageSwitch(page, ']', nextZ);
  const callsDuringNext = apiCalls.slice(callsBefore);

  // Back and forth between the two (both in the cache now), and once through the driver.
  await page.waitForTimeout(500);
  const switches: number[] = [];
  for (let i = 0; i < SWITCHES; i++) {
    switches.push(await inPageSwitch(page, i % 2 === 0 ? '[' : ']', i % 2 === 0 ? firstZ : nextZ));
    await page.waitForTimeout(300);
  }
  await page.locator('body').focus();
  const start = performance.now();
  await page.keyboard.press('[');
  while ((await trialZ.inputValue()) !== firstZ) await page.waitForTimeout(5);
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
  const cdpSwitchMs = performance.now() - start;
  await page.waitForTimeout(500);
  await browser.startTracing(page, { categories: TRACE_CATEGORIES });
  await inPageSwitch(page, ']', nextZ);
  await page.waitForTimeout(300);
  const switchTrace = summariseTrace(await browser.stopTracing(), 1, traceDir && `${traceDir}/switch.json`);
  if (traceDir) {
    await page.waitForTimeout(300);
    await profile(page, `${traceDir}/switch.cpuprofile`, () => inPageSwitch(page, '[', firstZ));
  }

  const result = {
    pixels: PIXELS,
    dragFrameMsMedian: round(median(dragFrames)),
    dragFrameMsP90: round(p90(dragFrames)),
    dragRafMsMedian: round(median(drag.rafs)),
    dragZ: drag.z,
    dragWithPanelsFrameMsMedian: round(median(dragWithPanels.frames)),
    dragWithPanelsFrameMsP90: round(p90(dragWithPanels.frames)),
    panelsInView: inView,
    dragTraceMainMsPerMove: dragTrace.mainMs,
    dragTraceRasterMsPerMove: dragTrace.rasterMs,
    nextSpectrumMs: round(nextSpectrumMs, 1),
    switchMsMedian: round(median(switches), 1),
    switchMsP90: round(p90(switches), 1),
    switchTraceMainMs: switchTrace.mainMs,
    switchTraceRasterMs: switchTrace.rasterMs,
    apiCallsDuringNext: callsDuringNext,
    cdpDragMsMedian: round(median(cdpFrames)),
    cdpDragMsP90: round(p90(cdpFrames)),
    cdpIdleMsMedian: round(median(cdpIdle)),
    cdpSwitchMs: round(cdpSwitchMs, 1),
    initialJsGzipKb: round(initialJsGzipKb, 1),
    note: 'in-page figures exclude the driver round trip; cdp… figures include it; load on the machine inflates all of them',
  };
  console.log(`drag (in page): median ${result.dragFrameMsMedian} ms from a pointer move to the end of its frame (p90 ${result.dragFrameMsP90} ms; to the animation-frame callback ${result.dragRafMsMedian} ms) on ${PIXELS} pixels; z ${drag.z.join(' → ')}`);
  console.log(`drag (in page, scrolled so ${inView} feature close-ups are in view and repaint too): median ${result.dragWithPanelsFrameMsMedian} ms (p90 ${result.dragWithPanelsFrameMsP90} ms)`);
  console.log(`drag (trace): ${result.dragTraceMainMsPerMove} ms main thread and ${result.dragTraceRasterMsPerMove} ms raster per move`);
  console.log(`next spectrum (prefetched, in page): ${result.nextSpectrumMs} ms from the key press to its trial z shown and plot drawn; back and forth between cached spectra: median ${result.switchMsMedian} ms (p90 ${result.switchMsP90} ms)`);
  console.log(`next spectrum (trace): ${result.switchTraceMainMs} ms main thread, ${result.switchTraceRasterMs} ms raster; API requests meanwhile: ${callsDuringNext.join(', ') || 'none'}`);
  console.log(`through the driver (CDP, old figures): drag ${result.cdpDragMsMedian} ms per move (p90 ${result.cdpDragMsP90} ms), the same without a drag ${result.cdpIdleMsMedian} ms; a spectrum switch ${result.cdpSwitchMs} ms`);
  console.log(`initial JavaScript of the inspection route: ${result.initialJsGzipKb} kB gzipped (${scriptSizes.join(', ')})`);
  console.log(JSON.stringify(result));
} finally {
  await browser.close();
  await server.cleanup();
}

/** A JavaScript profile of `run` (CDP Profiler), for DevTools (Performance → load profile) or a script. */
async function profile(page: Page, file: string, run: () => Promise<unknown>) {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Profiler.enable');
  await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
  await cdp.send('Profiler.start');
  await run();
  const { profile } = await cdp.send('Profiler.stop');
  writeFileSync(file, JSON.stringify(profile));
  await cdp.detach();
}

/**
 * Presses the comb down (a real press through the driver), then dispatches `moves` pointer moves
 * from inside the page, 3 CSS px apart, waiting for each one's frame. Returns per move the time to
 * the animation-frame callback and to the end of the frame, and the trial z before and after
 * (a drag that did not move the comb would be measuring nothing).
 */
async function inPageDrag(page: Page, moves: number) {
  const over = page.getByRole('group', { name: 'Spectrum plot' }).locator('.u-over').first();
  const box = (await over.boundingBox())!;
  const x0 = box.x + box.width * 0.3;
  const y = box.y + box.height / 2;
  await page.mouse.move(x0, y);
  await page.mouse.down();
  const out = await page.evaluate(
    async ({ x0, y, moves }) => {
      const el = document.querySelector('[aria-label="Spectrum plot"] .u-over')!;
      const input = document.querySelector<HTMLInputElement>('#trial-z')!;
      const zBefore = input.value;
      const frames: number[] = [];
      const rafs: number[] = [];
      // Resolves with [rAF callback time, frame end]: a task posted from the rAF callback runs after that frame's rendering.
      const nextFrame = () =>
        new Promise<[number, number]>((resolve) =>
          requestAnimationFrame(() => {
            const raf = performance.now();
            const channel = new MessageChannel();
            channel.port1.onmessage = () => resolve([raf, performance.now()]);
            channel.port2.postMessage(null);
          }),
        );
      await nextFrame();
      for (let i = 1; i <= moves; i++) {
        const start = performance.now();
        el.dispatchEvent(new PointerEvent('pointermove', { bubbles: true, cancelable: true, pointerId: 1, pointerType: 'mouse', isPrimary: true, buttons: 1, clientX: x0 + i * 3, clientY: y }));
        const [raf, end] = await nextFrame();
        rafs.push(raf - start);
        frames.push(end - start);
      }
      return { frames, rafs, zBefore, zAfter: input.value };
    },
    { x0, y, moves },
  );
  await page.mouse.up();
  if (out.zBefore === out.zAfter) throw new Error(`The in-page drag did not move the comb (trial z stayed ${out.zBefore}).`);
  return { frames: out.frames, rafs: out.rafs, z: [out.zBefore, out.zAfter] };
}

/**
 * Presses `key` (next or previous spectrum) inside the page and returns the time until the end of
 * the first frame in which the trial z reads `z` and the spectrum plot holds a drawn canvas.
 */
async function inPageSwitch(page: Page, key: '[' | ']', z: string): Promise<number> {
  return page.evaluate(
    async ({ key, z }) => {
      const shown = () => {
        const input = document.querySelector<HTMLInputElement>('#trial-z');
        const canvas = document.querySelector<HTMLCanvasElement>('[aria-label="Spectrum plot"] .uplot canvas');
        return input?.value === z && canvas !== null && canvas.width > 0;
      };
      const start = performance.now();
      document.body.dispatchEvent(new KeyboardEvent('keydown', { key, code: key === ']' ? 'BracketRight' : 'BracketLeft', bubbles: true, cancelable: true }));
      for (;;) {
        const done = await new Promise<boolean>((resolve) =>
          requestAnimationFrame(() => {
            const ok = shown();
            const channel = new MessageChannel();
            channel.port1.onmessage = () => resolve(ok);
            channel.port2.postMessage(null);
          }),
        );
        if (done) return performance.now() - start;
        if (performance.now() - start > 20_000) throw new Error(`The spectrum with trial z ${z} did not show within 20 s.`);
      }
    },
    { key, z },
  );
}

interface TraceEvent {
  ph: string;
  name: string;
  pid: number;
  tid: number;
  ts: number;
  dur?: number;
  args?: { name?: string };
}

/**
 * Busy time (union of complete events, ms) per `per` on the inspection page's renderer main thread,
 * and the time its raster tasks took (software raster on the renderer's worker threads). The
 * renderer is the process whose main thread ran the most.
 */
function summariseTrace(buffer: Buffer, per: number, keepAs: string | undefined) {
  if (keepAs) writeFileSync(keepAs, buffer);
  const events = (JSON.parse(buffer.toString('utf8')) as { traceEvents: TraceEvent[] }).traceEvents;
  const names = new Map<string, string>();
  for (const e of events) if (e.ph === 'M' && e.name === 'thread_name') names.set(`${e.pid}:${e.tid}`, e.args?.name ?? '');
  const spans = new Map<string, Array<[number, number]>>();
  for (const e of events) {
    if (e.ph !== 'X' || !e.dur) continue;
    const key = `${e.pid}:${e.tid}`;
    let list = spans.get(key);
    if (!list) spans.set(key, (list = []));
    list.push([e.ts, e.ts + e.dur]);
  }
  const busy = (list: Array<[number, number]>) => {
    list.sort((a, b) => a[0] - b[0]);
    let total = 0;
    let end = -Infinity;
    for (const [s, e] of list) {
      if (e <= end) continue;
      total += e - Math.max(s, end);
      end = e;
    }
    return total / 1000;
  };
  const main = [...spans.entries()]
    .filter(([key]) => names.get(key) === 'CrRendererMain')
    .map(([key, list]) => ({ pid: Number(key.split(':')[0]), ms: busy(list) }))
    .sort((a, b) => b.ms - a.ms)[0];
  const raster = events.filter((e) => e.ph === 'X' && e.name === 'RasterTask' && e.pid === main?.pid).reduce((s, e) => s + (e.dur ?? 0) / 1000, 0);
  return { mainMs: round((main?.ms ?? 0) / per), rasterMs: round(raster / per) };
}
