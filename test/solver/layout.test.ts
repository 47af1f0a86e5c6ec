// The solver's layout: one folder per subject, no folder imports from a folder that imports it, and
// the solver imports nothing of the service (fastify, zod) nor of Node (node:*). DEVELOPERS.md
// describes the folders; this test keeps the description true.
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const SOLVER = resolve(dirname(fileURLToPath(import.meta.url)), '../../src/solver');

function sources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? sources(join(dir, e.name)) : e.name.endsWith('.ts') ? [join(dir, e.name)] : []);
}

const SPECIFIER = /(?:^|\n)\s*(?:import|export)\b[^'"]*?from\s*['"]([^'"]+)['"]/g;
const specifiers = (file: string): string[] => [...readFileSync(file, 'utf8').matchAll(SPECIFIER)].map((m) => m[1]!);
/** The subject folder of a solver file ('' for files at the top, such as index.ts). */
const folderOf = (file: string): string => {
  const parts = relative(SOLVER, file).split('/');
  return parts.length > 1 ? parts[0]! : '';
};

/** Folder -> folders it imports from (its own excluded). */
function folderGraph(): Map<string, Set<string>> {
  const graph = new Map<string, Set<string>>();
  for (const file of sources(SOLVER)) {
    const from = folderOf(file);
    if (from === '') continue;
    const edges = graph.get(from) ?? new Set<string>();
    graph.set(from, edges);
    for (const spec of specifiers(file)) {
      if (!spec.startsWith('.')) continue;
      const target = resolve(dirname(file), spec);
      const to = folderOf(target);
      if (to !== from && to !== '') edges.add(to);
    }
  }
  return graph;
}

/** A cycle in the graph as a list of folders, or null when there is none (depth-first search). */
function findCycle(graph: Map<string, Set<string>>): string[] | null {
  const state = new Map<string, 'open' | 'done'>();
  const path: string[] = [];
  const visit = (node: string): string[] | null => {
    if (state.get(node) === 'done') return null;
    if (state.get(node) === 'open') return [...path.slice(path.indexOf(node)), node];
    state.set(node, 'open');
    path.push(node);
    for (const next of graph.get(node) ?? []) {
      const cycle = visit(next);
      if (cycle) return cycle;
    }
    path.pop();
    state.set(node, 'done');
    return null;
  };
  for (const node of graph.keys()) {
    const cycle = visit(node);
    if (cycle) return cycle;
  }
  return null;
}

describe('solver layout', () => {
  it('every solver file but index.ts lives in a subject folder', () => {
    const top = sources(SOLVER).filter((f) => folderOf(f) === '').map((f) => relative(SOLVER, f));
    expect(top).toEqual(['index.ts']);
  });

  it('the import graph between folders has no cycle', () => {
    const graph = folderGraph();
    expect(graph.size).toBeGreaterThan(5);
    expect(findCycle(graph)).toBeNull();
  });

  it('the cycle finder finds a planted cycle (the check above can fail)', () => {
    const planted = new Map([['a', new Set(['b'])], ['b', new Set(['c'])], ['c', new Set(['a'])]]);
    expect(findCycle(planted)).toEqual(['a', 'b', 'c', 'a']);
  });

  it('core imports from no other folder', () => {
    expect([...(folderGraph().get('core') ?? [])]).toEqual([]);
  });

  it('the solver imports nothing from fastify, zod or node:*', () => {
    const offending = sources(SOLVER).flatMap((file) =>
      specifiers(file).filter((s) => /^(node:|fastify|zod)/.test(s)).map((s) => `${relative(SOLVER, file)}: ${s}`));
    expect(offending).toEqual([]);
  });
});
