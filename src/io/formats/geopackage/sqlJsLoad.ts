import type { SqlJsStatic } from 'sql.js';
import { InputError } from '../../../core/common/InputError';

let nodeDefault: Promise<SqlJsStatic> | null = null;

/**
 * sql.js, ready to open databases: through `init` when given (the browser passes one that knows
 * where its wasm file is served), otherwise, in Node, loaded once with the wasm located by
 * require.resolve('sql.js/dist/sql-wasm.wasm'). Throws InputError outside Node without `init`.
 */
export function sqlJsLoad(init?: () => Promise<SqlJsStatic>): Promise<SqlJsStatic> {
  if (init) return init();
  const isNode = typeof process !== 'undefined' && Boolean(process.versions?.node);
  if (!isNode) return Promise.reject(new InputError('GeoPackage support needs sql.js; this build did not provide it'));
  nodeDefault ??= (async () => {
    // Specifiers held in variables so browser bundlers leave these Node-only imports alone.
    const moduleId = 'node:module';
    const sqlJsId = 'sql.js';
    const { createRequire } = (await import(/* @vite-ignore */ moduleId)) as typeof import('node:module');
    const require = createRequire(import.meta.url);
    const wasm = require.resolve('sql.js/dist/sql-wasm.wasm');
    const mod = (await import(/* @vite-ignore */ sqlJsId)) as unknown as { default?: (c: object) => Promise<SqlJsStatic> };
    const initSqlJs = (mod.default ?? mod) as unknown as (c: object) => Promise<SqlJsStatic>;
    return initSqlJs({ locateFile: () => wasm });
  })();
  return nodeDefault;
}
