import { mkdirSync } from 'node:fs';
import { XMLParser } from 'fast-xml-parser';
import Papa from 'papaparse';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { listHdus } from '../../backend/src/spectra/fits/listHdus';
import { launchBrowser, signInThroughPage, startE2eServer, waitForDemoScans, type E2eServer } from './browser';

let server: E2eServer;
let browser: Browser;

beforeAll(async () => {
  server = await startE2eServer({ demoSpectra: true });
  browser = await launchBrowser();
  // Both demo campaigns are scanned; the Lantern one (job 1) is the one these screens read.
  expect((await waitForDemoScans(server, [1, 2], 120_000))[0]).toBe('done');
}, 180_000);
afterAll(async () => {
  await browser?.close();
  await server?.cleanup();
});

type Row = Record<string, string>;

/** The rows of a FITS binary table as text (A columns trimmed, D columns as numbers written out). */
function fitsRows(bytes: Uint8Array): Row[] {
  const hdu = listHdus(bytes)[1]!;
  const v = (k: string) => hdu.header.values.get(k);
  const width = Number(v('NAXIS1'));
  const rows = Number(v('NAXIS2'));
  const view = new DataView(bytes.buffer, bytes.byteOffset);
  const cols: { name: string; form: string; offset: number; width: number }[] = [];
  let offset = 0;
  for (let i = 1; i <= Number(v('TFIELDS')); i++) {
    const form = String(v(`TFORM${i}`));
    const w = form.endsWith('A') ? Number(form.slice(0, -1)) : form === 'D' || form === 'K' ? 8 : 4;
    cols.push({ name: String(v(`TTYPE${i}`)), form, offset, width: w });
    offset += w;
  }
  return Array.from({ length: rows }, (_, r) => {
    const out: Row = {};
    for (const c of cols) {
      const at = hdu.dataOffset + r * width + c.offset;
      if (c.form.endsWith('A')) out[c.name] = bytes[at] === 0 ? '' : String.fromCharCode(...bytes.subarray(at, at + c.width)).trimEnd();
      else if (c.form === 'D') out[c.name] = Number.isNaN(view.getFloat64(at)) ? '' : String(view.getFloat64(at));
      else if (c.form === 'K') out[c.name] = String(view.getBigInt64(at));
    }
    return out;
  });
}

const fetchJson = (page: Page, url: string) => page.evaluate(async (u) => (await fetch(u)).json(), url);

it('taking the top solution ticks only the lines measured in the data; the confirmed exports carry them, z rounded to its error', async () => {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1100 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, 'reader1@demo.test');

  // LNT-S11: an emission-line galaxy of the demo at z ≈ 0.881 on 3600–9800 Å — [O II] and
  // [O III] 5008 in the data, Hα (at 12,350 Å) beyond its red end.
  const list = await fetchJson(page, '/api/campaigns/1/spectra?q=LNT-S11&pageSize=10');
  const spectrumId: number = list.rows[0].id;
  const detail = await fetchJson(page, `/api/spectra/${spectrumId}`);
  const top = detail.scan.solutions[0];
  expect(top.class).toBe('galaxy');
  expect(top.z).toBeCloseTo(0.8811, 2);

  await page.goto(`${server.url}/campaigns/1/inspect?spectrum=${spectrumId}`);
  const trialZ = page.getByRole('textbox', { name: 'Trial redshift' });
  await page.getByRole('group', { name: 'Spectrum plot' }).waitFor({ timeout: 30_000 });
  // Drag away first, then take the top solution: the list must follow the snapped z.
  await trialZ.fill('0.5');
  await trialZ.press('Enter');
  await page.getByRole('button', { name: /^Solution\s*1\s*:/ }).click();
  await expect.poll(() => trialZ.inputValue()).toBe(top.z.toFixed(5));

  const measured = page.getByRole('list', { name: 'Lines measured' });
  await expect.poll(async () => (await measured.locator('li[data-line="[O III] 5008"]').count()) > 0, { timeout: 15_000 }).toBe(true);
  const rows = await measured.locator('li[data-line]').evaluateAll((items) =>
    items.map((li) => ({
      name: li.getAttribute('data-line')!,
      detected: li.getAttribute('data-detected') === 'true',
      ticked: (li.querySelector('input[type=checkbox]') as HTMLInputElement).checked,
      measure: li.querySelector('[data-role=measure]')?.textContent ?? '',
      snr: li.querySelector('[data-role=snr]')?.textContent ?? '',
    })),
  );
  const ticked = rows.filter((r) => r.ticked).map((r) => r.name);
  // Only the measured lines are ticked: the [O II] doublet (one blend) and [O III] 5008.
  expect(ticked).toEqual(['[O II] 3727', '[O II] 3730', '[O III] 5008']);
  expect(rows.every((r) => r.ticked === r.detected)).toBe(true);
  // Lines on the data but not seen are listed, unticked; lines off the data are not listed at all.
  expect(rows.length).toBeGreaterThan(ticked.length);
  expect(rows.map((r) => r.name)).not.toContain('H-alpha');
  for (const r of rows.filter((x) => x.ticked)) {
    expect(r.measure).toMatch(/^-?[\d.]+(e[+-]\d+)? ± [\d.]+(e[+-]\d+)? /);
    expect(Number(/S\/N (-?[\d.]+)/.exec(r.snr)![1])).toBeGreaterThanOrEqual(3);
  }
  const errorText = await page.locator('[data-role=reading-error]').textContent();
  expect(errorText).toMatch(/resolution floor/);
  mkdirSync('test-results', { recursive: true });
  await page.getByRole('list', { name: 'Lines measured' }).screenshot({ path: 'test-results/lines-measured.png' });

  // Grade and save from the form.
  const firstGrade = detail.campaign.gradeScheme[0].code as string;
  await page.locator(`input[name=grade][value="${firstGrade}"]`).check();
  await page.getByRole('button', { name: 'Save reading and next' }).click();
  await expect.poll(() => new URL(page.url()).searchParams.get('spectrum'), { timeout: 15_000 }).not.toBe(String(spectrumId));
  const saved = (await fetchJson(page, `/api/spectra/${spectrumId}`)).readings[0];
  expect(saved.lines).toEqual(['[O II] 3727', '[O II] 3730', '[O III] 5008']);
  expect(saved.lineMeasurements.lines.map((m: { name: string }) => m.name)).toEqual(['[O II] 3727', '[O II] 3730', '[O III] 5008']);
  const floor: number = saved.lineMeasurements.zErrFloor;
  expect(saved.zErr).toBeCloseTo(Math.hypot(top.zErr, floor), 12);

  // The second reader agrees (through the same API the form uses): the value is confirmed.
  const second = await browser.newPage();
  await signInThroughPage(second, server.url, 'reader2@demo.test');
  const status = await second.evaluate(
    async ({ id, body }) => (await fetch(`/api/spectra/${id}/readings`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) })).status,
    { id: spectrumId, body: { z: top.z, zErr: top.zErr, grade: firstGrade, class: 'galaxy', lines: ['[O II] 3727', '[O II] 3730', '[O III] 5008'] } },
  );
  expect(status).toBe(200);

  // Every export of the confirmed table carries the lines with their measurements, z to its error's digits, the error ≥ the floor.
  const lead = await browser.newPage();
  await signInThroughPage(lead, server.url, 'lead@demo.test');
  const get = (format: string) => lead.evaluate(async (f) => (await fetch(`/api/campaigns/1/confirmed?format=${f}`)).text(), format);
  const csvRow = Papa.parse<Row>(await get('csv'), { header: true, comments: '#', skipEmptyLines: true }).data.find((r) => r.spectrum_id === String(spectrumId))!;
  const ecsvText = await get('ecsv');
  const ecsvRow = Papa.parse<Row>(ecsvText.split('\n').filter((l) => !l.startsWith('#')).join('\n'), { header: true, skipEmptyLines: true }).data.find((r) => r.spectrum_id === String(spectrumId))!;
  const vot = new XMLParser({ ignoreAttributes: false }).parse(await get('votable'));
  const table = vot.VOTABLE.RESOURCE.TABLE;
  const names = (table.FIELD as { '@_name': string }[]).map((f) => f['@_name']);
  const trs = [table.DATA.TABLEDATA.TR].flat() as { TD: unknown[] }[];
  const votRows = trs.map((tr) => Object.fromEntries(names.map((n, i) => [n, typeof tr.TD[i] === 'object' || tr.TD[i] === undefined ? '' : String(tr.TD[i])])) as Row);
  const votRow = votRows.find((r) => r.spectrum_id === String(spectrumId))!;
  const fitsBytes = await lead.evaluate(async () => Array.from(new Uint8Array(await (await fetch('/api/campaigns/1/confirmed?format=fits')).arrayBuffer())));
  const fitsRow = fitsRows(new Uint8Array(fitsBytes)).find((r) => r.spectrum_id === String(spectrumId))!;

  for (const [format, row] of [['csv', csvRow], ['ecsv', ecsvRow], ['votable', votRow], ['fits', fitsRow]] as const) {
    expect(row, format).toBeDefined();
    expect(row.lines_measured, format).toMatch(/^\[O II\] 3727\+\[O II\] 3730:flux=[\d.e+-]+\+\/-[\d.e+-]+:sn=\d+\.\d:dv=-?\d+;\[O III\] 5008:flux=[\d.e+-]+\+\/-[\d.e+-]+:sn=\d+\.\d:dv=-?\d+$/);
    const zErr = Number(row.z_err);
    expect(zErr, format).toBeGreaterThanOrEqual(Number(row.z_err_floor));
    expect(Number(row.z_err_floor), format).toBeCloseTo(floor, 6);
    // Two significant digits of the error fix the decimals of z.
    const decimals = 2 - 1 - Math.floor(Math.log10(zErr));
    expect(Math.round(Number(row.z) * 10 ** decimals) / 10 ** decimals, format).toBe(Number(row.z));
    expect(Math.abs(Number(row.z) - top.z), format).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
    expect(row.z_caveat, format).toBe('');
  }
  expect(ecsvText).toMatch(/lya_caveat: .*Shapley et al\. 2003, from memory/);
  expect(pageErrors).toEqual([]);
}, 120_000);

it('a Lyman-break reading shows the Lyα caveat beside its error', async () => {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1100 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, 'reader2@demo.test');
  // LNT-A1.1: the demo's triply imaged Lyman-break source with Lyα emission at z = 6.143.
  const list = await fetchJson(page, '/api/campaigns/1/spectra?q=LNT-A1.1&pageSize=10');
  const spectrumId: number = list.rows[0].id;
  const top = (await fetchJson(page, `/api/spectra/${spectrumId}`)).scan.solutions[0];
  expect(top.class).toBe('lyman-break');
  await page.goto(`${server.url}/campaigns/1/inspect?spectrum=${spectrumId}`);
  await page.getByRole('group', { name: 'Spectrum plot' }).waitFor({ timeout: 30_000 });
  await page.getByRole('button', { name: /^Solution\s*1\s*:/ }).click();
  const lya = page.getByRole('list', { name: 'Lines measured' }).locator('li[data-line="Ly-alpha"]');
  await expect.poll(() => lya.getAttribute('data-detected'), { timeout: 15_000 }).toBe('true');
  expect(await lya.locator('input[type=checkbox]').isChecked()).toBe(true);
  await expect.poll(() => page.getByRole('status').allTextContents()).toContainEqual(expect.stringMatching(/z rests on Lya alone: .*Shapley et al\. 2003, from memory/));
  expect(await page.locator('[data-role=reading-error]').textContent()).toMatch(/engine 0\.\d{5} ⊕ resolution floor 0\.\d{5}/);
  await page.getByRole('form', { name: 'Reading' }).screenshot({ path: 'test-results/reading-form-lyman-break.png' });
  expect(pageErrors).toEqual([]);
}, 60_000);
