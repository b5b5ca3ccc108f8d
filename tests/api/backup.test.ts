import { execFile } from 'node:child_process';
import { appendFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import Database from 'better-sqlite3';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tableCounts } from '../../backend/src/backup/backup-files';
import { restoreBackup } from '../../backend/src/backup/restore-backup';
import { takeBackup } from '../../backend/src/backup/take-backup';
import { loadConfig } from '../../backend/src/config';
import { createRedward } from '../../backend/src/server';
import { signInDemoMembers, uploadAssignedSpectra } from '../helpers/assigned-spectra';
import { createTestApp, TEST_ORIGIN, type TestApp } from '../helpers/test-app';

const run = promisify(execFile);

let t: TestApp;
let work: string;
const source = () => ({ databasePath: t.ctx.config.databasePath, uploadsDir: t.ctx.config.uploadsDir, redwardVersion: t.ctx.config.version });
const redwardOn = (dataDir: string) =>
  createRedward(loadConfig({ DATA_DIR: dataDir, MAIL_CATCHER_PORT: '0', LOG_LEVEL: 'silent', REDWARD_DEMO: '0', JOB_RUNNER: '0', PUBLIC_URL: TEST_ORIGIN }));

beforeAll(async () => {
  t = await createTestApp({ SCAN_THREADS: '2' });
  work = mkdtempSync(path.join(tmpdir(), 'redward-backup-test-'));
  const ids = await uploadAssignedSpectra(t, 4, 'BAK');
  const { reader1 } = await signInDemoMembers(t);
  expect((await reader1.post(`/api/spectra/${ids[0]}/readings`).send({ z: 0.42, grade: 'likely', class: 'galaxy', lines: [], note: 'backed up' })).status).toBe(200);
}, 120_000);
afterAll(async () => {
  await t.cleanup();
  rmSync(work, { recursive: true, force: true });
});

describe('backup and restore', () => {
  it('backs up a running instance and restores it into a new DATA_DIR with the same rows and uploads', async () => {
    const lead = await t.signIn('lead@demo.test');
    // The server keeps answering (and writing) while the backup runs.
    const [summary, during] = await Promise.all([takeBackup(source(), path.join(work, 'b1')), lead.patch('/api/account').send({ name: 'Lena During Backup' })]);
    expect(during.status).toBe(200);
    expect(summary.blobs).toBe(4);
    const manifest = JSON.parse(readFileSync(path.join(work, 'b1', 'manifest.json'), 'utf8'));
    expect(manifest).toMatchObject({ format: 'redward-backup', formatVersion: 1, redwardVersion: t.ctx.config.version });
    expect(manifest.database.tables).toMatchObject({ spectra: 4, stored_files: 4, readings: 1, scan_results: 4, users: 5 });
    expect(existsSync(path.join(work, 'b1.partial'))).toBe(false);

    const restored = path.join(work, 'restored');
    const result = await restoreBackup(path.join(work, 'b1'), restored);
    expect(result.blobs).toBe(4);

    const live = tableCounts(t.ctx.db.$client);
    const copy = new Database(path.join(restored, 'redward.sqlite'), { readonly: true });
    const copied = tableCounts(copy);
    copy.close();
    for (const table of ['users', 'campaigns', 'memberships', 'spectra', 'stored_files', 'scan_results', 'readings', 'assignments', 'targets', 'jobs', 'job_items']) {
      expect(copied[table], table).toBe(live[table]);
    }
    expect(readdirSync(path.join(restored, 'uploads')).length).toBeGreaterThan(0);

    // The restored folder starts as a Redward (integrity check included) and serves the data.
    const second = await redwardOn(restored);
    try {
      const agent = request.agent(second.app).set('Origin', TEST_ORIGIN);
      expect((await agent.post('/api/auth/login').send({ email: 'lead@demo.test', password: 'redward-demo' })).status).toBe(200);
      const list = await agent.get('/api/campaigns/1/spectra?q=BAK&sort=fileName');
      expect(list.body.total).toBe(4);
      const data = await agent.get(`/api/spectra/${list.body.rows[0].id}/data`);
      expect(data.status).toBe(200);
    } finally {
      await second.close();
    }
  }, 60_000);

  it('refuses to write into an existing backup folder or restore into a non-empty DATA_DIR', async () => {
    await expect(takeBackup(source(), path.join(work, 'b1'))).rejects.toThrow(/already exists/);
    const busy = path.join(work, 'busy');
    mkdirSync(busy);
    writeFileSync(path.join(busy, 'redward.sqlite'), 'precious');
    await expect(restoreBackup(path.join(work, 'b1'), busy)).rejects.toThrow(`${busy} is not empty (it holds redward.sqlite). Restore into an empty DATA_DIR; move the old one aside first.`);
    expect(readFileSync(path.join(busy, 'redward.sqlite'), 'utf8')).toBe('precious');
    await expect(restoreBackup(work, path.join(work, 'nowhere'))).rejects.toThrow(/is not a Redward backup: it has no manifest\.json/);
  });

  it('detects a tampered upload and leaves DATA_DIR empty', async () => {
    await takeBackup(source(), path.join(work, 'b2'));
    const manifest = JSON.parse(readFileSync(path.join(work, 'b2', 'manifest.json'), 'utf8'));
    const victim: string = manifest.blobs[2].sha256;
    appendFileSync(path.join(work, 'b2', 'uploads', victim.slice(0, 2), victim), '\n1e308,1,1\n');
    const into = path.join(work, 'empty');
    mkdirSync(into);
    const failure = restoreBackup(path.join(work, 'b2'), into);
    await expect(failure).rejects.toThrow(`uploads/${victim.slice(0, 2)}/${victim} has been changed`);
    await expect(failure).rejects.toThrow(/failed its checks; nothing was restored/);
    expect(readdirSync(into)).toEqual([]);
  });

  it('runs as npm scripts: backup prints a summary, restore exits 1 naming a tampered database', async () => {
    const env = { ...process.env, DATA_DIR: t.dataDir, LOG_LEVEL: 'silent' };
    const out = await run('npx', ['tsx', 'backend/src/cli/backup.ts', path.join(work, 'b3')], { env });
    expect(out.stdout).toMatch(/^Backup written to .*b3\n {2}database: [\d.]+ MB \(.*spectra 4.*\)\n {2}uploads: 4 files/m);

    writeFileSync(path.join(work, 'b3', 'redward.sqlite'), 'not the database');
    const into = path.join(work, 'cli-restore');
    const failed = await run('npx', ['tsx', 'backend/src/cli/restore.ts', path.join(work, 'b3')], { env: { ...env, DATA_DIR: into } }).catch((e: { code: number; stderr: string }) => e);
    expect('code' in failed && failed.code).toBe(1);
    expect((failed as { stderr: string }).stderr).toMatch(/redward\.sqlite differs from the manifest/);
    expect(existsSync(into)).toBe(false);
  }, 60_000);
});

describe('integrity check at start', () => {
  it('refuses to start on a damaged database, saying what to do', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'redward-damaged-'));
    try {
      const first = await redwardOn(dir);
      await first.close();
      // Overwrite the e-mail in the users' unique index: the table and its index disagree.
      const file = path.join(dir, 'redward.sqlite');
      const db = new Database(file);
      db.exec("insert into users (email, name, password_hash) values ('someone@example.org', 'Someone', 'x')");
      const root = db.prepare("select rootpage from sqlite_master where name = 'users_email_unique'").pluck().get() as number;
      const pageSize = db.pragma('page_size', { simple: true }) as number;
      db.close();
      const bytes = readFileSync(file);
      const page = bytes.subarray((root - 1) * pageSize, root * pageSize);
      const at = page.indexOf('someone@example.org');
      expect(at).toBeGreaterThan(0);
      page.write('nobody!', at);
      writeFileSync(file, bytes);

      await expect(redwardOn(dir)).rejects.toThrow(/failed its integrity check \(PRAGMA integrity_check\):\n {2}.*users_email_unique[\s\S]*npm run restore -- <backup>/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
