import type { Plugin } from 'vite';
import { defineConfig } from 'vite';

// Built pages only: the dev server injects styles from JavaScript, which a strict style-src forbids.
const CSP = [
  "default-src 'self'",
  "script-src 'self' 'wasm-unsafe-eval'",
  "worker-src 'self' blob:",
  "style-src 'self'",
  // The one online tile host the planner offers (off until the user turns it on).
  "img-src 'self' data: blob: https://tile.openstreetmap.org",
  "connect-src 'self' data: blob: https://tile.openstreetmap.org",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'none'",
].join('; ');

function contentSecurityPolicy(): Plugin {
  return {
    name: 'stratplot-csp',
    apply: 'build',
    transformIndexHtml: (html) => html.replace('<meta charset="utf-8" />', `<meta charset="utf-8" />\n    <meta http-equiv="Content-Security-Policy" content="${CSP}" />`),
  };
}

// The service worker caches every built file on install, so the planner works offline after one visit.
function offlineFileList(): Plugin {
  return {
    name: 'stratplot-offline-list',
    apply: 'build',
    generateBundle(_options, bundle) {
      const files = ['/', ...Object.keys(bundle).map((f) => `/${f}`), '/manifest.webmanifest', '/icon.svg'];
      this.emitFile({ type: 'asset', fileName: 'offline-files.json', source: JSON.stringify(files.filter((f) => f !== '/offline-files.json')) });
    },
  };
}

export default defineConfig({
  plugins: [contentSecurityPolicy(), offlineFileList()],
  worker: { format: 'es' },
  build: { chunkSizeWarningLimit: 4000, sourcemap: false },
  server: { host: '127.0.0.1' },
  preview: { host: '127.0.0.1' },
});
