import { randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/**
 * SESSION_SECRET when given; otherwise a secret generated on first start and kept in
 * DATA_DIR (mode 600), so sessions survive restarts and no secret lives in the code.
 */
export function loadSessionSecret(dataDir: string, configured: string | undefined): string {
  if (configured) return configured;
  const file = path.join(dataDir, 'session-secret');
  try {
    const stored = readFileSync(file, 'utf8').trim();
    if (stored.length >= 32) return stored;
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
  }
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  // 'wx' refuses to overwrite: if another process won the race, use its secret.
  try {
    writeFileSync(file, secret + '\n', { mode: 0o600, flag: 'wx' });
    return secret;
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'EEXIST') return readFileSync(file, 'utf8').trim();
    throw err;
  }
}
