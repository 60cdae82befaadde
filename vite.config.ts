import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// In `npm run dev` the browser talks to Vite; API and sign-in routes are proxied so that the
// session cookie and the OpenID Connect redirect stay on one origin.
const apiOrigin = process.env.WARDBOOK_API_ORIGIN ?? 'http://127.0.0.1:3000';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      // Request and response schemas are shared with the API (server/**/schema.ts only).
      '@server': fileURLToPath(new URL('./server', import.meta.url)),
    },
  },
  server: {
    host: '127.0.0.1',
    port: Number(process.env.WARDBOOK_DEV_PORT ?? 5173),
    strictPort: true,
    proxy: {
      '/api': { target: apiOrigin },
      '/auth': { target: apiOrigin },
    },
  },
  build: {
    outDir: process.env.WARDBOOK_CLIENT_OUT_DIR ?? 'dist',
    emptyOutDir: true,
    sourcemap: true,
  },
});
