import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// The API runs on its own port in development; Vite proxies /api to it.
const apiPort = process.env.PORT ?? '8080';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: { outDir: 'dist', chunkSizeWarningLimit: 6000 },
  server: { proxy: { '/api': `http://127.0.0.1:${apiPort}` } },
  worker: { format: 'es' },
});
