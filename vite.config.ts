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
  build: {
    outDir: r('./frontend/dist'),
    emptyOutDir: true,
    sourcemap: true,
    rolldownOptions: {
      output: {
        // Libraries change less often than our code: separate chunks stay cached across releases.
        codeSplitting: {
          groups: [
            { name: 'react', test: /node_modules[\\/](react|react-dom|react-router|react-router-dom|scheduler)[\\/]/, priority: 3 },
            { name: 'plot', test: /node_modules[\\/]uplot[\\/]/, priority: 2 },
            { name: 'vendor', test: /node_modules[\\/]/, priority: 1 },
          ],
        },
      },
    },
  },
  server: {
    port: Number(process.env.PORT ?? 3000),
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
});
