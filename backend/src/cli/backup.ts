import { loadConfig } from '../config';
import { BackupError, takeBackup } from '../backup/take-backup';

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

/**
 * `npm run backup -- <new folder>`: an online backup of DATA_DIR (the server may keep running):
 * the database, every stored upload, and a manifest with their sha-256. See README, "Backups".
 */
async function main() {
  const args = process.argv.slice(2);
  if (args.length !== 1 || args[0]!.startsWith('-')) {
    console.error('Usage: npm run backup -- <new backup folder>   (DATA_DIR names what is backed up)');
    process.exit(2);
  }
  const config = loadConfig();
  const summary = await takeBackup({ databasePath: config.databasePath, uploadsDir: config.uploadsDir, redwardVersion: config.version }, args[0]!);
  const rows = Object.entries(summary.tables)
    .filter(([name]) => !name.startsWith('__'))
    .map(([name, n]) => `${name} ${n}`)
    .join(', ');
  console.log(
    [
      `Backup written to ${summary.target}`,
      `  database: ${mb(summary.databaseBytes)} (${rows})`,
      `  uploads: ${summary.blobs} files, ${mb(summary.blobBytes)}, each hashed`,
      'Copy the whole folder to another disk or machine; `npm run restore -- <folder>` checks and restores it.',
    ].join('\n'),
  );
}

main().catch((err: unknown) => {
  console.error(err instanceof BackupError ? err.message : err instanceof Error ? `Backup failed: ${err.message}` : err);
  process.exit(1);
});
