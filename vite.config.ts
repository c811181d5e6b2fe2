import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';

// The API runs on its own port in development; Vite proxies /api to it.
const apiPort = process.env.PORT ?? '8080';

export default defineConfig({
  // Brotli and gzip copies of every text asset next to it, made once at build; the server sends
  // the smallest one the browser accepts (server/http/clientAssets.ts).
  plugins: [react(), tailwindcss(), compression({ algorithms: ['brotliCompress', 'gzip'], threshold: 1024, include: /\.(js|mjs|css|html|svg|json|wasm)$/ })],
  build: { outDir: 'dist', chunkSizeWarningLimit: 6000 },
  server: { proxy: { '/api': `http://127.0.0.1:${apiPort}` } },
  worker: { format: 'es' },
});
