import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

const r = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// The client build. The server (server/app.ts) serves dist/ and /api on one port;
// in development `vite` proxies /api to it.
export default defineConfig({
  plugins: [react()],
  resolve: { alias: { '@shared': r('./shared'), '@': r('./src') } },
  server: { proxy: { '/api': 'http://127.0.0.1:3000' } },
  build: { outDir: 'dist', sourcemap: false, chunkSizeWarningLimit: 1500 },
});
