import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

const apiTarget = process.env.DEV_API_URL ?? 'http://127.0.0.1:3001';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: {
    // Fonts are small enough as files; never inline them as data URLs (CSP and caching).
    assetsInlineLimit: 0,
    sourcemap: false,
    // `.vite/manifest.json`: `npm run bench` reads the episode route's first-load JavaScript from it.
    manifest: true,
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: { '/api': { target: apiTarget, changeOrigin: false }, '/auth': { target: apiTarget } },
  },
});
