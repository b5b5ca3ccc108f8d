import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { inArray } from 'drizzle-orm';
import { chromium, type Browser, type Page } from 'playwright-core';
import { loadConfig } from '../../backend/src/config';
import { jobs } from '../../backend/src/db/schema';
import { startServer, type RunningServer } from '../../backend/src/server';

export const CHROMIUM_PATH = '/usr/bin/chromium';

/** Debian's Chromium, headless; the flags keep it from reaching out to the (closed) network. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update'],
  });
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

export interface E2eServer extends RunningServer {
  cleanup(): Promise<void>;
}

/**
 * A real Redward on a free port with a fresh data folder and demo data. PUBLIC_URL must be
 * known before boot so the links in invitation e-mails point at this server.
 */
export async function startE2eServer(options: { demoSpectra?: boolean; env?: Record<string, string> } = {}): Promise<E2eServer> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'redward-e2e-'));
  const port = await freePort();
  const server = await startServer(
    loadConfig({
      DATA_DIR: dataDir,
      PORT: String(port),
      HOST: '127.0.0.1',
      PUBLIC_URL: `http://localhost:${port}`,
      MAIL_CATCHER_PORT: '0',
      LOG_LEVEL: 'silent',
      REDWARD_DEMO_SPECTRA: options.demoSpectra ? '1' : '0',
      ...options.env,
    }),
  );
  return {
    ...server,
    async cleanup() {
      await server.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Signs in through the sign-in page, as a person would, and waits for the campaigns list. */
export async function signInThroughPage(page: Page, baseUrl: string, email: string, password = 'redward-demo'): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/campaigns/);
}

/**
 * Waits until the demo seed's scan jobs (ids 1 and 2 on a new database) are done and returns
 * their states in the order asked, so a test can assert on them rather than time out later on an
 * empty screen.
 */
export async function waitForDemoScans(server: E2eServer, jobIds: number[] = [1, 2], timeoutMs = 180_000): Promise<string[]> {
  const db = server.ctx.db;
  const states = () => {
    const rows = db.select({ id: jobs.id, state: jobs.state }).from(jobs).where(inArray(jobs.id, jobIds)).all();
    return jobIds.map((id) => rows.find((r) => r.id === id)?.state ?? 'missing');
  };
  for (const end = Date.now() + timeoutMs; Date.now() < end; ) {
    const now = states();
    if (now.every((s) => s === 'done')) return now;
    await new Promise((r) => setTimeout(r, 100));
  }
  return states();
}
