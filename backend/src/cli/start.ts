import { loadConfig } from '../config';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../demo/demo-accounts';
import { startServer } from '../server';
import { buildFrontendIfStale } from './frontend-build';

/** `npm start`: one command from a fresh clone to a running Redward. */
async function main() {
  const config = loadConfig();
  await buildFrontendIfStale();
  const server = await startServer(config);
  const lines = [
    '',
    `Redward ${config.version} is running at ${config.publicUrl ?? server.url}`,
    `Data folder: ${config.dataDir}`,
    server.mailCatcher
      ? `Mail: local catcher on 127.0.0.1:${server.mailCatcher.port} (admins read it under Admin → Caught mail)`
      : `Mail: sent through ${config.smtpUrl.replace(/\/\/[^@/]*@/, '//***@')}`,
  ];
  if (config.demo) {
    lines.push(server.seeded ? 'Demo data seeded into the new database.' : 'Demo mode (the database already existed; nothing re-seeded).');
    lines.push(`Demo sign-ins (password "${DEMO_PASSWORD}"): ${DEMO_ACCOUNTS.map((a) => a.email).join(', ')}`);
  }
  console.log(lines.join('\n') + '\n');

  const stop = async (signal: string) => {
    console.log(`\n${signal} received; stopping Redward.`);
    await server.close();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop('SIGINT'));
  process.once('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
