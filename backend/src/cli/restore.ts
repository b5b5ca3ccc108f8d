import { loadConfig } from '../config';
import { RestoreError, restoreBackup } from '../backup/restore-backup';

/**
 * `npm run restore -- <backup folder>`: restores into DATA_DIR, which must be empty (or absent),
 * checking every hash first. Start Redward afterwards as usual. See README, "Backups".
 */
async function main() {
  const args = process.argv.slice(2);
  if (args.length !== 1 || args[0]!.startsWith('-')) {
    console.error('Usage: DATA_DIR=<empty folder> npm run restore -- <backup folder>');
    process.exit(2);
  }
  const config = loadConfig();
  const summary = await restoreBackup(args[0]!, config.dataDir);
  console.log(
    [
      `Restored the backup of ${summary.backupCreatedAt} into ${summary.dataDir}`,
      `  ${summary.blobs} uploads and the database checked against their sha-256; integrity_check ok; row counts as backed up.`,
      'Start Redward with this DATA_DIR. Unless SESSION_SECRET is set, everyone signs in again (the session secret is not part of a backup).',
    ].join('\n'),
  );
}

main().catch((err: unknown) => {
  console.error(err instanceof RestoreError ? err.message : err instanceof Error ? `Restore failed: ${err.message}` : err);
  process.exit(1);
});
