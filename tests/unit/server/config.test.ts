import { mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../../backend/src/config';
import { loadSessionSecret } from '../../../backend/src/session-secret';

describe('loadConfig', () => {
  it('gives the embedded defaults', () => {
    const c = loadConfig({});
    expect(c.port).toBe(3000);
    expect(c.dataDir).toBe(path.resolve('./data'));
    expect(c.databasePath).toBe(path.resolve('./data/redward.sqlite'));
    expect(c.smtpUrl).toBe('smtp://127.0.0.1:2525');
    expect(c.mailCatcher).toEqual({ enabled: true, port: 2525 });
    expect(c.demo).toBe(true);
  });

  it('does not run the catcher when SMTP_URL points at a real relay', () => {
    const c = loadConfig({ SMTP_URL: 'smtps://user:pw@mail.example.org:465', REDWARD_DEMO: '0' });
    expect(c.mailCatcher.enabled).toBe(false);
    expect(c.demo).toBe(false);
  });

  it('stops with a sentence naming the bad variable', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => loadConfig({ SESSION_SECRET: 'short' })).toThrow(/SESSION_SECRET must be at least 32 characters/);
  });
});

describe('loadSessionSecret', () => {
  it('generates a secret once, stores it privately and reuses it', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'redward-secret-'));
    try {
      const first = loadSessionSecret(dir, undefined);
      expect(first.length).toBeGreaterThanOrEqual(32);
      expect(loadSessionSecret(dir, undefined)).toBe(first);
      expect(readFileSync(path.join(dir, 'session-secret'), 'utf8').trim()).toBe(first);
      expect(statSync(path.join(dir, 'session-secret')).mode & 0o777).toBe(0o600);
      expect(loadSessionSecret(dir, 'x'.repeat(40))).toBe('x'.repeat(40));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
