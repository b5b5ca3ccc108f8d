import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { loadConfig } from '../../backend/src/config';
import { validateResponses } from '../../backend/src/http/define-route';
import { createRedward, type Redward } from '../../backend/src/server';

export const TEST_ORIGIN = 'http://redward.test';

export interface TestApp extends Redward {
  dataDir: string;
  /** A movable clock: tests advance it instead of sleeping. */
  clock: { now: Date; advanceHours(h: number): void };
  /** A cookie-keeping client that sends our Origin, as a browser on the Redward page would. */
  agent(): ReturnType<typeof request.agent>;
  signIn(email: string, password?: string): Promise<ReturnType<typeof request.agent>>;
  cleanup(): Promise<void>;
}

/**
 * A complete Redward on its own temporary data folder: migrated SQLite, demo seed, a real
 * mail catcher on an ephemeral port, JSON answers checked against their response schemas.
 * One per test file keeps files independent.
 */
export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'redward-test-'));
  const config = loadConfig({
    DATA_DIR: dataDir,
    MAIL_CATCHER_PORT: '0',
    LOG_LEVEL: 'silent',
    PUBLIC_URL: TEST_ORIGIN,
    // The demo accounts and campaigns, without the 120 synthetic spectra (tests bring their own).
    REDWARD_DEMO_SPECTRA: '0',
    ...env,
  });
  const clock = {
    now: new Date(),
    advanceHours(h: number) {
      clock.now = new Date(clock.now.getTime() + h * 3600_000);
    },
  };
  const redward = await createRedward(config, () => clock.now);
  // Every JSON answer is parsed with its route's contract, so drift between a service and the
  // schema the client parses it with fails the test that made the request.
  validateResponses(redward.ctx);
  const agent = () => request.agent(redward.app).set('Origin', TEST_ORIGIN);
  return {
    ...redward,
    dataDir,
    clock,
    agent,
    async signIn(email, password = 'redward-demo') {
      const a = agent();
      const res = await a.post('/api/auth/login').send({ email, password });
      if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return a;
    },
    async cleanup() {
      await redward.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Waits until the mail catcher has stored a message matching `predicate` (SMTP is asynchronous). */
export async function waitForMail<T>(find: () => T | undefined, timeoutMs = 5000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = find();
    if (found !== undefined) return found;
    if (Date.now() > deadline) throw new Error('no matching e-mail reached the mail catcher');
    await new Promise((r) => setTimeout(r, 25));
  }
}

/**
 * Polls a job until it is done, failed or cancelled and returns its view. A non-200 answer on
 * the way is a failure of the test, not a reason to keep polling.
 */
export async function waitForJob(agent: ReturnType<TestApp['agent']>, jobId: number) {
  for (let i = 0; i < 600; i++) {
    const res = await agent.get(`/api/jobs/${jobId}`);
    if (res.status !== 200) throw new Error(`GET /api/jobs/${jobId} answered ${res.status}: ${JSON.stringify(res.body)}`);
    if (['done', 'failed', 'cancelled'].includes(res.body.state)) return res.body;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`job ${jobId} did not finish`);
}
