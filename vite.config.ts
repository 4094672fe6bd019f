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
      // changeOrigin stays false: the API compares the browser's Origin with the Host it receives, and both are then
      // the dev server's address.
      '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false },
    },
  },
});
