// Bundles the TypeScript sources with esbuild: the Node entry points into dist/, the browser matcher into dist/browser/.

import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

/** Node entry points: name in dist/ → source. Missing sources are skipped so a partial tree still builds. */
const nodeEntries = {
  bandshelf: 'src/cli/main.ts',
  index: 'src/index.ts',
  demo: 'scripts/demo.ts',
  'demo-data': 'scripts/writeDemoData.ts',
  schema: 'scripts/writeSchemas.ts',
  bench: 'scripts/bench.ts',
  'bench-site': 'scripts/benchSite.ts',
  'bench-matcher': 'scripts/benchMatcher.ts',
  'bench-ingest': 'scripts/benchIngest.ts',
  'bench-cli': 'scripts/benchCli.ts',
  validate: 'scripts/validateMixture.ts',
  'bench-cross-source': 'scripts/benchCrossSource.ts',
  'validate-contrast': 'scripts/validateContrast.ts',
  fuzz: 'scripts/fuzz.ts',
  'scores-worker': 'src/match/scoresWorker.ts',
};

const browserEntries = {
  'bandshelf-browser': 'src/site/browser/main.ts',
  'bandshelf-worker': 'src/site/browser/matchWorker.ts',
};

function existing(entries) {
  return Object.fromEntries(Object.entries(entries).filter(([, src]) => existsSync(join(root, src))));
}

export async function buildAll() {
  const node = existing(nodeEntries);
  await build({
    absWorkingDir: root,
    entryPoints: Object.fromEntries(Object.entries(node).map(([k, v]) => [k, join(root, v)])),
    outdir: join(root, 'dist'),
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    sourcemap: 'linked',
    logLevel: 'warning',
    loader: { '.wasm': 'binary' },
  });
  const browser = existing(browserEntries);
  if (Object.keys(browser).length > 0) {
    await build({
      absWorkingDir: root,
      entryPoints: Object.fromEntries(Object.entries(browser).map(([k, v]) => [k, join(root, v)])),
      outdir: join(root, 'dist', 'browser'),
      bundle: true,
      platform: 'browser',
      format: 'iife',
      target: 'es2020',
      minify: true,
      legalComments: 'none',
      logLevel: 'warning',
      loader: { '.wasm': 'binary' },
    });
    // The worker's source as a data script (see src/site/dataScript.ts): the page loads it with a <script> tag and
    // starts the worker from a Blob URL, which Chromium allows from file:// where it refuses `new Worker(fileUrl)`.
    const worker = join(root, 'dist', 'browser', 'bandshelf-worker.js');
    if (existsSync(worker)) {
      const source = readFileSync(worker, 'utf8').replace(/\n?\/\/# sourceMappingURL=\S+\s*$/, '\n');
      const text = JSON.stringify(source)
        .replace(/</g, '\\u003c')
        .replace(/\u2028/g, '\\u2028')
        .replace(/\u2029/g, '\\u2029');
      writeFileSync(
        join(root, 'dist', 'browser', 'bandshelf-worker-source.js'),
        `(self.__bandshelf=self.__bandshelf||{})["worker-source"]=${text};\n`,
      );
    }
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  await buildAll();
}
