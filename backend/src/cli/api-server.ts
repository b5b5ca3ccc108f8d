import { loadConfig } from '../config';
import { startServer } from '../server';

/** The API alone, for `npm run dev` (Vite serves the UI and proxies /api here). */
const config = loadConfig({ ...process.env, PORT: process.env.API_PORT ?? '3001', HOST: '127.0.0.1' });
startServer(config)
  .then((s) => console.log(`Redward API (dev) on ${s.url}/api`))
  .catch((err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
