import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// The client is built into dist/ and served by Express in production; in development the
// Vite dev server proxies /api and /collab to the Express server on port 3000.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  // no bundler timing report: `npm start` builds with --logLevel warn and should print warnings only
  build: { outDir: 'dist', emptyOutDir: true, chunkSizeWarningLimit: 2000, rolldownOptions: { checks: { bundlerTimings: false } } },
  worker: { format: 'es' },
  server: {
    port: 5173,
    proxy: {
      '/api': 'http://localhost:3000',
      '/collab': { target: 'ws://localhost:3000', ws: true },
    },
  },
});
