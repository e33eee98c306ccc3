/**
 * JavaScript weight per page: builds the client with a Vite manifest into a temporary directory and
 * prints, for every route in src/app/router.tsx, the gzipped JavaScript a first visit to that page
 * loads before it can render (the entry chunk plus the page chunk and everything both import
 * statically), against a budget of 150 kB gzipped per page, and the entry alone as the baseline of
 * the same run. Parts a page loads later on its own (dynamic imports other than the pages, such as
 * the map) are shown in a separate column. The figures are printed as measured, with no verdict.
 *
 *   npm run bench:bundle
 *
 * gzip level 9 (what `compression` does at its default level 6 is within about 1% of it); "kB" is
 * 1000 bytes.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { build } from 'vite';

const BUDGET_KB = 150;
const root = path.resolve(import.meta.dirname, '..');

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}
type Manifest = Record<string, ManifestChunk>;

const outDir = fs.mkdtempSync(path.join(os.tmpdir(), 'kindloop-bundle-'));
try {
  await build({ root, logLevel: 'warn', build: { outDir, emptyOutDir: true, manifest: 'manifest.json' } });
  const manifest: Manifest = JSON.parse(fs.readFileSync(path.join(outDir, 'manifest.json'), 'utf8'));

  const gzCache = new Map<string, number>();
  const gz = (key: string) => {
    const file = manifest[key].file;
    if (!file.endsWith('.js')) return 0;
    if (!gzCache.has(file)) gzCache.set(file, gzipSync(fs.readFileSync(path.join(outDir, file)), { level: 9 }).length);
    return gzCache.get(file)!;
  };

  /** The chunk and everything it imports statically, transitively. */
  const closure = (keys: string[], into = new Set<string>()) => {
    for (const key of keys) {
      if (into.has(key)) continue;
      into.add(key);
      closure(manifest[key].imports ?? [], into);
    }
    return into;
  };
  const sum = (keys: Iterable<string>) => [...keys].reduce((n, k) => n + gz(k), 0);

  const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry)!;
  const entrySet = closure([entryKey]);
  const entryBytes = sum(entrySet);

  // Route paths and their page modules, read from the router so new pages are measured too.
  const routerSrc = fs.readFileSync(path.join(root, 'src/app/router.tsx'), 'utf8');
  const routes = [...routerSrc.matchAll(/\{\s*(?:path:\s*'([^']*)'|index:\s*true)[^\n]*?import\('\.\/(routes\/[^']+)'\)/g)].map((m) => ({
    path: m[1] === undefined ? '/' : `/${m[1]}`,
    key: `src/app/${m[2]}.tsx`,
  }));
  const pageKeys = new Set(routes.map((r) => r.key));

  const kB = (n: number) => (n / 1000).toFixed(1);
  const rows = routes.map((r) => {
    if (!manifest[r.key]) throw new Error(`no chunk for ${r.key} in the manifest`);
    const first = closure([r.key], new Set(entrySet));
    // Parts loaded later by the page itself: dynamic imports reachable from its first load, not other pages.
    const later = new Set<string>();
    for (const k of first) for (const d of manifest[k].dynamicImports ?? []) if (!pageKeys.has(d)) closure([d], later);
    for (const k of first) later.delete(k);
    return { path: r.path, bytes: sum(first), later: sum(later) };
  });

  console.log(`Gzipped JavaScript per page (entry + page chunk + static imports), budget ${BUDGET_KB} kB`);
  console.log(`Entry alone (baseline): ${kB(entryBytes)} kB (${manifest[entryKey].file} and ${entrySet.size - 1} chunks it imports)\n`);
  console.log('| page | first load kB gz | × budget | loaded later kB gz |');
  console.log('|---|---|---|---|');
  for (const r of rows) {
    console.log(`| ${r.path} | ${kB(r.bytes)} | ${(r.bytes / (BUDGET_KB * 1000)).toFixed(2)}× | ${r.later ? kB(r.later) : '–'} |`);
  }
  const over = rows.filter((r) => r.bytes > BUDGET_KB * 1000).length;
  console.log(`\n${rows.length} pages, ${over} above ${BUDGET_KB} kB on first load; entry alone ${(entryBytes / (BUDGET_KB * 1000)).toFixed(2)}× the budget.`);
} finally {
  fs.rmSync(outDir, { recursive: true, force: true });
}
