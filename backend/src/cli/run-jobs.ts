import { loadConfig } from '../config';
import { createRedward } from '../server';

/**
 * `npm run jobs`: a job runner without the web server, for machines that only scan, and for
 * the crash-safety test that kills it mid-job. Several runners may share one database: a job
 * is claimed atomically and held by a lease.
 */
async function main() {
  const base = loadConfig();
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
