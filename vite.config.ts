import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';

const apiPort = process.env.PORT ?? '3000';

export default defineConfig({
  root: 'client',
  publicDir: '../public',
  plugins: [react(), tailwindcss()],
  resolve: { alias: { '@contracts': fileURLToPath(new URL('./server/contracts', import.meta.url)) } },
  build: { outDir: '../dist/client', emptyOutDir: true, chunkSizeWarningLimit: 1200, manifest: true },
  server: { port: 5173, proxy: { '/api': `http://127.0.0.1:${apiPort}` } },
});
