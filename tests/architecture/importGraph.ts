import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';

/** One relative import: the importing file and the file it resolves to, both repository paths. */
export interface ImportEdge {
  from: string;
  to: string;
  line: number;
}

const SOURCE = /\.(ts|tsx|mjs)$/;
const SPECIFIER = /(?:\bfrom\s*|\bimport\s*\(\s*|\bimport\s+|\bvi\.mock\(\s*|\bimport\.meta\.glob\(\s*)(['"])(\.{1,2}\/[^'"]+)\1/g;
const EXTENSIONS = ['', '.ts', '.tsx', '.mjs', '.d.ts', '/index.ts'];

function walk(dir: string, out: string[]): void {
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) walk(path, out);
    else if (SOURCE.test(name)) out.push(path);
  }
}

/** Every source file (.ts, .tsx, .mjs) under the given folders, as repository paths. */
export function sourceFiles(root: string, folders: string[]): string[] {
  const files: string[] = [];
  for (const f of folders) walk(join(root, f), files);
  return files.map((f) => relative(root, f));
}

/** Every relative import under the given folders, resolved to a file (query suffixes such as `?raw` dropped). */
export function importEdges(root: string, folders: string[]): ImportEdge[] {
  const files: string[] = [];
  for (const f of folders) walk(join(root, f), files);
  const edges: ImportEdge[] = [];
  for (const file of files) {
    const text = readFileSync(file, 'utf8');
    for (const m of text.matchAll(SPECIFIER)) {
      const spec = m[2].replace(/\?.*$/, '');
      if (spec.includes('*')) continue;
      const base = join(dirname(file), spec);
      const hit = EXTENSIONS.map((e) => base + e).find((p) => existsSync(p) && statSync(p).isFile());
      const line = text.slice(0, m.index).split('\n').length;
      edges.push({ from: relative(root, file), to: hit ? relative(root, hit) : relative(root, base), line });
    }
  }
  return edges;
}


/** Cycles in a directed graph given as adjacency sets (Tarjan's strongly connected components). */
export function stronglyConnected(graph: Map<string, Set<string>>): string[][] {
  let index = 0;
  const idx = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const on = new Set<string>();
  const out: string[][] = [];
  const visit = (v: string): void => {
    idx.set(v, index);
    low.set(v, index++);
    stack.push(v);
    on.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!idx.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (on.has(w)) low.set(v, Math.min(low.get(v)!, idx.get(w)!));
    }
    if (low.get(v) === idx.get(v)) {
      const comp: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        on.delete(w);
        comp.push(w);
      } while (w !== v);
      if (comp.length > 1) out.push(comp.sort());
    }
  };
  for (const v of graph.keys()) if (!idx.has(v)) visit(v);
  return out;
}
