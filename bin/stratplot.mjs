#!/usr/bin/env node
// Runs the bundled CLI, rebuilding it first when any source is newer than the bundle, so that
// `npx stratplot` works straight after `npm ci` and stays fast (one file to load) afterwards.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const bundle = join(root, 'dist-cli', 'stratplot.mjs');

function newestMtime(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestMtime(path));
    else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.test.ts')) newest = Math.max(newest, statSync(path).mtimeMs);
  }
  return newest;
}

function isStale() {
  if (!existsSync(bundle)) return true;
  const built = statSync(bundle).mtimeMs;
  const sources = ['src/core', 'src/io', 'src/cli'].map((d) => join(root, d)).filter(existsSync);
  const lock = join(root, 'package-lock.json');
  return Math.max(...sources.map(newestMtime), existsSync(lock) ? statSync(lock).mtimeMs : 0) > built;
}

if (isStale()) {
  const { buildCli } = await import('../scripts/build-cli.mjs');
  await buildCli();
}
await import(pathToFileURL(bundle).href);
