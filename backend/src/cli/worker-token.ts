import { loadConfig } from '../config';
import { openDatabase } from '../db/client';
import { createWorkerToken } from '../services/worker-tokens';

/**
 * `npm run worker-token -- <name>` on the server: makes a worker token for a scan machine and
 * prints it once (only its hash is kept). Give it to `npm run jobs` there as REDWARD_WORKER_TOKEN.
 * Admins can also make, list and revoke them over the API (/api/admin/worker-tokens).
 */
function main() {
  const name = process.argv.slice(2).join(' ').trim();
  if (!name) {
    console.error('Usage: npm run worker-token -- <name of the scan machine>');
    process.exit(2);
  }
  const db = openDatabase(loadConfig().databasePath);
  try {
    const { token, workerToken } = createWorkerToken({ db }, null, name);
    console.log(`Worker token ${workerToken.id} for "${name}" (shown once; revoke it with DELETE /api/admin/worker-tokens/${workerToken.id}):`);
    console.log(token);
  } finally {
    db.$client.close();
  }
}

main();
