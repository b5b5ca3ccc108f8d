import { existsSync } from 'node:fs';
import { buildFrontendIfStale } from '../../backend/src/cli/frontend-build';
import { CHROMIUM_PATH } from './browser';

/** Browser tests need Debian's Chromium and the built UI; both are checked once, up front. */
export default async function setup(): Promise<void> {
  if (!existsSync(CHROMIUM_PATH)) {
    // Never skip: a missing browser is a broken test machine, and CI installs it (.ci/run).
    throw new Error(`Chromium not found at ${CHROMIUM_PATH}. Install it with: apt-get install -y chromium`);
  }
  await buildFrontendIfStale((line) => process.stdout.write(`[e2e] ${line}\n`));
}
