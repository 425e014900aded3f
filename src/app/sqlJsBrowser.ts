import type { SqlJsStatic } from 'sql.js';

/**
 * Loads sql.js in the page with its wasm file located through Vite's `?url` import, for the
 * GeoPackage reader and writer (`sqlJsInit` option). Both are large, so they are fetched only
 * when a GeoPackage is first read or written; the service worker keeps them for offline use.
 */
export async function sqlJsBrowser(): Promise<SqlJsStatic> {
  const [{ default: initSqlJs }, { default: wasmUrl }] = await Promise.all([import('sql.js'), import('sql.js/dist/sql-wasm.wasm?url')]);
  return initSqlJs({ locateFile: () => wasmUrl });
}
