import { loadConfig } from '../config';
import { startRemoteWorker } from '../jobs/redis/redis-worker';
import { createRedward } from '../server';

/**
 * `npm run jobs`: scans without the web server.
 *
 * - JOB_QUEUE=sqlite (default): a job runner on this machine's database. Several runners may share
 *   one database: a job is claimed atomically and held by a lease.
 * - JOB_QUEUE=redis://host:6379: a remote scan worker for the server at REDWARD_SERVER_URL, with the
 *   worker token REDWARD_WORKER_TOKEN. Start one on every machine that should scan; none of them
 *   opens the database.
 */
async function main() {
  const base = loadConfig();
  if (base.jobs.queue.kind === 'redis') {
    const worker = startRemoteWorker(base, (line) => console.log(line), (err) => {
      console.error(err.message);
      void worker.close().finally(() => process.exit(1));
    });
    console.log(`Redward scan worker: ${worker.threads} thread(s), queue ${base.jobs.queue.url}, server ${base.jobs.worker.serverUrl}.`);
    const stop = async () => {
      await worker.close();
      process.exit(0);
    };
    process.once('SIGINT', () => void stop());
    process.once('SIGTERM', () => void stop());
    return;
  }
  const redward = await createRedward({ ...base, demo: false, mailCatcher: { ...base.mailCatcher, enabled: false }, jobs: { ...base.jobs, runner: true } });
  console.log(`Redward job runner on ${base.databasePath} (lease ${base.jobs.leaseMs / 1000} s).`);
  const stop = async () => {
    await redward.close();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop());
  process.once('SIGTERM', () => void stop());
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
