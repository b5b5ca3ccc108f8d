import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { uploadAssignedSpectra } from '../helpers/assigned-spectra';
import type { TestApp } from '../helpers/test-app';
import { launchBrowser, signInThroughPage, startE2eServer, type E2eServer } from './browser';

let server: E2eServer;
let browser: Browser;
let spectrumId: number;

beforeAll(async () => {
  server = await startE2eServer();
  browser = await launchBrowser();
  // uploadAssignedSpectra needs only the context and a way to sign in; give it the running server's.
  const asTestApp = { ctx: server.ctx, signIn: (email: string) => signInAgent(email) } as unknown as TestApp;
  [spectrumId] = (await uploadAssignedSpectra(asTestApp, 1, 'SETTLE')) as [number];
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await server?.cleanup();
});

async function signInAgent(email: string) {
  const { default: request } = await import('supertest');
  const agent = request.agent(server.app).set('Origin', server.url).set('Host', new URL(server.url).host);
  await agent.post('/api/auth/login').send({ email, password: 'redward-demo' });
  return agent;
}

async function readAs(page: Page, email: string, z: number) {
  await signInThroughPage(page, server.url, email);
  const res = await page.evaluate(
    async ({ id, z }) => (await fetch(`/api/spectra/${id}/readings`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ z, grade: 'sure', class: 'galaxy', lines: [] }) })).status,
    { id: spectrumId, z },
  );
  expect(res).toBe(200);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);
}

it('two readers disagree; the lead sees both combs, settles, and the confirmed table shows and downloads the value', async () => {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await readAs(page, 'reader1@demo.test', 0.52);
  await readAs(page, 'reader2@demo.test', 1.87);

  await signInThroughPage(page, server.url, 'lead@demo.test');
  await page.goto(`${server.url}/campaigns/1`);
  await page.getByRole('link', { name: /Disagreements \(1 open\)/ }).click();
  await page.getByRole('navigation', { name: 'Open disagreements' }).getByRole('link').first().click();
  await page.getByRole('group', { name: "Spectrum with both readings' combs" }).waitFor();
  const combs = page.getByRole('list', { name: 'Combs' });
  await expect.poll(() => combs.textContent()).toMatch(/first reading, z = 0\.52000.*second reading, z = 1\.87000/s);

  await page.getByLabel('Reason').fill('Hα and [N II] are resolved at 0.52; 1.87 misread Hα as [O II].');
  await page.getByRole('button', { name: 'Accept first reading' }).click();
  await expect.poll(() => page.getByRole('status').allTextContents()).toContainEqual(expect.stringMatching(/Settled .*confirmed record #\d+ released/));

  await page.goto(`${server.url}/campaigns/1/confirmed`);
  const table = page.getByRole('table', { name: 'Confirmed redshifts' });
  await expect.poll(() => table.textContent(), { timeout: 15_000 }).toContain('0.52000');
  // Reader agreement is reported from the same records: one pair, read both, agreed on none.
  const agreement = page.getByRole('table', { name: 'Agreement between readers' });
  await expect.poll(() => agreement.textContent(), { timeout: 15_000 }).toMatch(/Rafael Demo \(reader 1\) and Rosa Demo \(reader 2\)\s*1\s*0 %/);
  const download = page.waitForEvent('download');
  await page.getByRole('link', { name: 'Download CSV' }).click();
  const file = await download;
  expect(file.suggestedFilename()).toMatch(/^lantern-cluster-arcs-confirmed-\d{4}-\d{2}-\d{2}\.csv$/);
  const { readFileSync } = await import('node:fs');
  const csv = readFileSync((await file.path())!, 'utf8');
  expect(csv).toMatch(/^# .*vacuum/m);
  expect(csv).toContain('0.52');
  expect(pageErrors).toEqual([]);
});
