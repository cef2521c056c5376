// Guards the layering rule: each layer imports only from the layers below it, and browser code has no Node imports.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const src = join(root, 'src');

/** Lowest first; a file may import from its own rank or below. */
const RANK: Record<string, number> = {
  'error.ts': 0,
  schema: 0,
  spectrum: 1,
  formats: 2,
  library: 3,
  match: 4,
  site: 5,
  cli: 6,
  demo: 6,
  'index.ts': 7,
};

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name);
    if (statSync(full).isDirectory()) return walk(full);
    return /\.(ts|mts|mjs)$/.test(name) && !name.endsWith('.d.ts') ? [full] : [];
  });
}

function layerOf(file: string): string {
  const top = relative(src, file).split('/')[0]!;
  return top;
}

function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  const found: string[] = [];
  for (const m of text.matchAll(/(?:^|\n)\s*(?:import|export)\s[^'"]*?from\s+['"]([^'"]+)['"]/g))
    found.push(m[1]!);
  for (const m of text.matchAll(/(?:^|\n)\s*import\s+['"]([^'"]+)['"]/g)) found.push(m[1]!);
  for (const m of text.matchAll(/import\(\s*['"]([^'"]+)['"]\s*\)/g)) found.push(m[1]!);
  return found;
}

const files = walk(src);

describe('layers', () => {
  it('finds the source tree', () => {
    expect(files.length).toBeGreaterThan(5);
  });

  for (const file of files) {
    const name = relative(root, file);
    it(`${name} imports only from its own layer or below`, () => {
      const own = RANK[layerOf(file)];
      expect(own, `unknown layer for ${name}`).toBeDefined();
      for (const spec of importsOf(file)) {
        if (!spec.startsWith('.')) continue;
        const target = resolve(dirname(file), spec).replace(/\.js$/, '.ts');
        const targetRank = RANK[layerOf(target)];
        expect(targetRank, `${name} imports ${spec}`).toBeDefined();
        expect(targetRank!, `${name} imports ${spec} from a higher layer`).toBeLessThanOrEqual(own!);
      }
    });
  }
});

describe('browser-safe code', () => {
  /** Everything reachable from the browser bundle's entry, plus the spectrum and formats layers as a whole. */
  function reachable(entry: string, seen = new Set<string>()): Set<string> {
    if (seen.has(entry)) return seen;
    seen.add(entry);
    for (const spec of importsOf(entry)) {
      if (!spec.startsWith('.')) continue;
      const target = resolve(dirname(entry), spec).replace(/\.js$/, '.ts');
      if (files.includes(target)) reachable(target, seen);
    }
    return seen;
  }
  const browserEntry = join(src, 'site', 'browser', 'main.ts');
  const browserFiles = new Set<string>(
    files.filter((f) => ['spectrum', 'formats', 'schema', 'error.ts'].includes(layerOf(f))),
  );
  if (files.includes(browserEntry)) for (const f of reachable(browserEntry)) browserFiles.add(f);

  for (const file of browserFiles) {
    it(`${relative(root, file)} has no Node-only imports`, () => {
      for (const spec of importsOf(file)) {
        expect(spec.startsWith('node:'), `${spec}`).toBe(false);
        expect(
          ['fs', 'path', 'os', 'child_process', 'worker_threads', 'better-sqlite3'].includes(spec),
          spec,
        ).toBe(false);
      }
    });
  }
});
