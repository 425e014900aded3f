import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

/** Bundles src/cli into dist-cli/stratplot.mjs (one file, dependencies inlined, for a quick start). */
export async function buildCli() {
  await build({
    // The design's second thread is a file of its own beside the command (src/cli/designStagesAhead.ts).
    entryPoints: { stratplot: join(root, 'src/cli/index.ts'), designStagesWorker: join(root, 'src/cli/designStagesWorker.ts') },
    outdir: join(root, 'dist-cli'),
    outExtension: { '.js': '.mjs' },
    bundle: true,
    // Code loaded only on demand (the PDF writers) goes to chunks of its own, so a plan starts sooner.
    splitting: true,
    chunkNames: 'chunks/[name]-[hash]',
    platform: 'node',
    format: 'esm',
    target: 'node20',
    logLevel: 'error',
    // sql.js loads its wasm beside itself; jspdf's optional HTML helpers are never used by the CLI.
    external: ['sql.js', 'canvg', 'html2canvas', 'dompurify'],
    banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
  });
}

if (process.argv[1] === fileURLToPath(import.meta.url)) await buildCli();
