import { mkdirSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
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

const signIn = (page: Page, email: string, password: string) => signInThroughPage(page, server.url, email, password);

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);
}

it('a lead invites a new reader, who accepts by e-mail and sees the campaign', async () => {
  const page = await browser.newPage();
  const consoleErrors: string[] = [];
  page.on('pageerror', (err) => consoleErrors.push(err.message));

  // The lead signs in and invites a new reader from the campaign overview.
  await signIn(page, 'lead@demo.test', 'redward-demo');
  await page.getByRole('link', { name: 'Lantern Cluster arcs' }).click();
  await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Lantern Cluster arcs');
  await page.getByLabel('Invitee e-mail').fill('nova.reader@example.org');
  await page.getByLabel('Role').selectOption('reader');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect.poll(() => page.getByRole('status').allTextContents()).toContainEqual(
    expect.stringContaining('Invitation sent to nova.reader@example.org'),
  );
  await signOut(page);

  // The admin finds the invitation among the caught mail.
  await signIn(page, 'admin@demo.test', 'redward-demo');
  await page.goto(`${server.url}/admin/mail`);
  await page.getByRole('heading', { name: 'Caught mail' }).waitFor();
  await page.getByRole('link', { name: /Invitation to join Lantern Cluster arcs/ }).or(page.getByRole('button', { name: /Invitation to join Lantern Cluster arcs/ })).first().click();
  const link = page.locator('a[href*="/invitations/"]').first();
  const href = await link.getAttribute('href');
  expect(href).toMatch(new RegExp(`^${server.url}/invitations/[A-Za-z0-9_-]{43}$`));
  await signOut(page);

  // The new reader opens the link, sets a password and lands in the campaign.
  await page.goto(href!);
  await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Lantern Cluster arcs');
  await page.getByLabel('Your name').fill('Nova Reader');
  await page.getByLabel('New password').fill('spectra-at-dawn');
  await page.getByLabel('Repeat password').fill('spectra-at-dawn');
  await page.getByRole('button', { name: 'Create account and join' }).click();
  await page.waitForURL(/\/campaigns\/1$/);
  await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Lantern Cluster arcs');
  await signOut(page);

  // Later the reader signs in with the new password and sees the campaign listed.
  await signIn(page, 'nova.reader@example.org', 'spectra-at-dawn');
  await page.getByRole('link', { name: 'Lantern Cluster arcs' }).waitFor();
  mkdirSync('test-results', { recursive: true });
  await page.screenshot({ path: 'test-results/reader-campaigns.png', fullPage: true });

  // The same link a second time is refused with a clear message.
  await page.goto(href!);
  await expect.poll(() => page.getByRole('alert').allTextContents()).toContainEqual(expect.stringContaining('already been used'));
  expect(consoleErrors).toEqual([]);
});
