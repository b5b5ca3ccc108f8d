import { fileURLToPath } from 'node:url';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

const r = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// The Express API listens on API_PORT during `npm run dev`; Vite serves the UI and proxies /api to it.
const apiPort = process.env.API_PORT ?? '3001';

export default defineConfig({
  root: r('./frontend'),
  plugins: [react(), tailwindcss()],
  resolve: { alias: { '@contracts': r('./backend/src/contracts'), '@': r('./frontend/src') } },
  build: { outDir: r('./frontend/dist'), emptyOutDir: true, sourcemap: true },
  server: {
    port: Number(process.env.PORT ?? 3000),
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
});
