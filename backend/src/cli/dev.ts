import { spawn } from 'node:child_process';

/**
 * `npm run dev`: the API under `tsx watch` on API_PORT (3001) and the Vite dev server on PORT
 * (3000) proxying /api to it. Ctrl-C stops both.
 */
const apiPort = process.env.API_PORT ?? '3001';
const env = { ...process.env, API_PORT: apiPort, PUBLIC_URL: process.env.PUBLIC_URL ?? `http://localhost:${process.env.PORT ?? '3000'}` };
const children = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'backend/src/cli/api-server.ts'], { stdio: 'inherit', env }),
  spawn('npx', ['vite'], { stdio: 'inherit', env }),
];
const stopAll = () => children.forEach((c) => c.kill('SIGTERM'));
process.once('SIGINT', stopAll);
process.once('SIGTERM', stopAll);
for (const child of children) child.on('exit', (code) => { stopAll(); process.exitCode = code ?? 0; });
