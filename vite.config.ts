import { defineConfig } from 'vite';

/**
 * Builds the web client (client/) into dist/client, which the server serves at `/`.
 * The output has no inline scripts, so the server can send `script-src 'self'`.
 */
export default defineConfig({
  root: 'client',
  base: '/',
  build: {
    outDir: '../dist/client',
    emptyOutDir: true,
    // Keeps the module-preload polyfill (an inline script in some versions) out of index.html.
    modulePreload: { polyfill: false },
    assetsInlineLimit: 0,
    sourcemap: true,
    target: 'es2022',
  },
  server: {
    // `vite` in dev: forward API calls to a locally running sheaf server.
    proxy: { '/api': 'http://127.0.0.1:8080' },
  },
});
