import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { type ImportEdge, importEdges, sourceFiles, stronglyConnected } from './importGraph';

// The layer ladder and folder map are the project's own rules (ARCHITECTURE.md); biome.json
// enforces the ladder at lint time, this test enforces it on resolved paths and adds what lint cannot:
// loops and the order of folders inside a layer. Common practice, no source.
const ROOT = join(import.meta.dirname, '..', '..');
const EDGES = importEdges(ROOT, ['src']);
const isTest = (path: string) => /\.test\.tsx?$/.test(path) || path.includes('/fixtures/');
const layerOf = (path: string) => path.split('/')[1];
const folderOf = (path: string) => path.split('/').slice(0, -1).join('/');

/** Which layers each layer may import (its own included). */
const LADDER: Record<string, readonly string[]> = {
  core: ['core'],
  io: ['io', 'core'],
  state: ['state', 'io', 'core'],
  worker: ['worker', 'io', 'core'],
  cli: ['cli', 'io', 'core'],
  app: ['app', 'state', 'io', 'core', 'worker'],
};

/** One library, one wrapper: the only source files that may import each of these packages. */
const WRAPPED: Record<string, string> = {
  proj4: 'src/core/geo/projection.ts',
  'polyclip-ts': 'src/core/geometry/polygonClip.ts',
  'geographiclib-geodesic': 'src/core/geo/geodesic.ts',
};

function folderLadder(): string[] {
  const text = readFileSync(join(ROOT, 'ARCHITECTURE.md'), 'utf8');
  const block = text.split('<!-- folder-ladder:start -->')[1]?.split('<!-- folder-ladder:end -->')[0] ?? '';
  return [...block.matchAll(/^\| `([^`]+)` \|/gm)].map((m) => m[1]);
}

const show = (edges: ImportEdge[]) => edges.map((e) => `${e.from}:${e.line} -> ${e.to}`);

describe('the layer ladder', () => {
  it('every source file, tests included, imports only its own layer or those below it', () => {
    const breaches = EDGES.filter((e) => e.to.startsWith('src/') && !LADDER[layerOf(e.from)].includes(layerOf(e.to)));
    expect(show(breaches)).toEqual([]);
  });

  it('source files import nothing outside src/ (tests may read demo maps and shared test helpers)', () => {
    const outside = EDGES.filter((e) => !isTest(e.from) && !e.to.startsWith('src/') && !e.to.startsWith('demo-maps/') && e.to !== 'package.json');
    expect(show(outside)).toEqual([]);
  });

  it('no two source files import each other, directly or round a loop', () => {
    const graph = new Map<string, Set<string>>();
    for (const e of EDGES) if (!isTest(e.from) && e.to.startsWith('src/')) graph.set(e.from, (graph.get(e.from) ?? new Set()).add(e.to));
    expect(stronglyConnected(graph)).toEqual([]);
  });
});

describe('folders by concern in src/core and src/io', () => {
  const ladder = folderLadder();
  const inScope = (folder: string) => folder.startsWith('src/core/') || folder.startsWith('src/io/');
  const sourceFolders = [...new Set(EDGES.map((e) => folderOf(e.from)).filter((f) => inScope(f) && !f.includes('/fixtures')))];

  it('ARCHITECTURE.md lists every folder', () => {
    expect(ladder.length).toBeGreaterThan(10);
    expect(sourceFolders.filter((f) => !ladder.includes(f))).toEqual([]);
  });

  it('a folder imports only from folders listed above it', () => {
    const up = EDGES.filter((e) => {
      if (isTest(e.from) || !e.to.startsWith('src/')) return false;
      const a = folderOf(e.from);
      const b = folderOf(e.to);
      return a !== b && inScope(a) && inScope(b) && layerOf(a) === layerOf(b) && ladder.indexOf(b) > ladder.indexOf(a);
    });
    expect(show(up)).toEqual([]);
  });
});

describe('each library wrapped once', () => {
  const files = sourceFiles(ROOT, ['src']).filter((f) => !isTest(f));
  for (const [pkg, wrapper] of Object.entries(WRAPPED)) {
    it(`${pkg} is imported only by ${wrapper}`, () => {
      const users = files.filter((f) => new RegExp(`from '${pkg}'`).test(readFileSync(join(ROOT, f), 'utf8')));
      expect(users.filter((f) => f !== wrapper)).toEqual([]);
    });
  }
});
