import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

// The client is built into dist/client; the Express server serves it in production.
// In development the Vite server forwards /api to the local API server.
const apiPort = process.env.KILOWATCH_PORT ?? '3000';

export default defineConfig({
  plugins: [react()],
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
    sourcemap: true,
  },
  server: {
    proxy: {
      '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false },
    },
  },
});
