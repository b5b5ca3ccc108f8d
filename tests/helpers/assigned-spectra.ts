import { writeFileSync } from 'node:fs';
import { eq } from 'drizzle-orm';
import { jobs, users } from '../../backend/src/db/schema';
import { receiveUpload } from '../../backend/src/services/receive-upload';
import { syntheticSpectrumFiles } from './spectrum-archives';
import type { TestApp } from './test-app';

export const userIdOf = (t: TestApp, email: string) => t.ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email)).get()!.id;

/**
 * Uploads `count` synthetic spectra to campaign 1 as the demo lead, assigned (unless told not
 * to) to reader1 (first) and reader2 (second), and waits until they are stored and scanned.
 * Returns the spectrum ids in file-name order.
 */
export async function uploadAssignedSpectra(t: TestApp, count: number, prefix: string, assign = true): Promise<number[]> {
  const lead = { id: userIdOf(t, 'lead@demo.test'), email: 'lead@demo.test', name: 'Lena', isAdmin: false };
  const files = Object.entries(syntheticSpectrumFiles(count, { prefix })).map(([name, bytes]) => {
    const tempFile = t.ctx.store.tempPath();
    writeFileSync(tempFile, bytes);
    return { originalName: name, tempFile };
  });
  const { jobId } = await receiveUpload(
    t.ctx,
    t.ctx.store,
    lead,
    1,
    files,
    assign ? { assign: { first: userIdOf(t, 'reader1@demo.test'), second: userIdOf(t, 'reader2@demo.test') } } : {},
  );
  t.ctx.wakeJobRunner();
  for (let i = 0; i < 600 && t.ctx.db.select().from(jobs).where(eq(jobs.id, jobId)).get()!.state !== 'done'; i++) {
    await new Promise((r) => setTimeout(r, 100));
  }
  const leadAgent = await t.signIn('lead@demo.test');
  return ((await leadAgent.get(`/api/campaigns/1/spectra?q=${prefix}&pageSize=500&sort=fileName`)).body.rows as { id: number }[]).map((r) => r.id);
}

export type Agent = ReturnType<TestApp['agent']>;

/** Signed-in clients for the four demo campaign members. */
export async function signInDemoMembers(t: TestApp): Promise<{ reader1: Agent; reader2: Agent; lead: Agent; observer: Agent }> {
  return {
    reader1: await t.signIn('reader1@demo.test'),
    reader2: await t.signIn('reader2@demo.test'),
    lead: await t.signIn('lead@demo.test'),
    observer: await t.signIn('observer@demo.test'),
  };
}
