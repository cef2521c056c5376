// Copies every script and style the pages load into the output, so the site never asks another host for one.
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { BandshelfError } from '../error.js';

export interface CopySiteAssetsOptions {
  /** Only check that every source exists; write nothing.
   * @default false */
  checkOnly?: boolean;
}

/** Output path (under the site) → source path (under the package root). */
function assetSources(root: string): [string, string][] {
  const modules = join(root, 'node_modules');
  const list: [string, string][] = [
    ['assets/vendor/vega.min.js', join(modules, 'vega', 'build', 'vega.min.js')],
    ['assets/vendor/vega-lite.min.js', join(modules, 'vega-lite', 'build', 'vega-lite.min.js')],
    ['assets/vendor/vega-embed.min.js', join(modules, 'vega-embed', 'build', 'vega-embed.min.js')],
    ['assets/vendor/lunr.min.js', join(modules, 'lunr', 'lunr.min.js')],
    // Licences travel with the code they cover; vega-interpreter is bundled into bandshelf-browser.js.
    ['assets/vendor/LICENSE-vega.txt', join(modules, 'vega', 'LICENSE')],
    ['assets/vendor/LICENSE-vega-lite.txt', join(modules, 'vega-lite', 'LICENSE')],
    ['assets/vendor/LICENSE-vega-embed.txt', join(modules, 'vega-embed', 'LICENSE')],
    ['assets/vendor/LICENSE-vega-interpreter.txt', join(modules, 'vega-interpreter', 'LICENSE')],
    ['assets/vendor/LICENSE-lunr.txt', join(modules, 'lunr', 'LICENSE')],
    ['assets/bandshelf-browser.js', join(root, 'dist', 'browser', 'bandshelf-browser.js')],
    ['assets/bandshelf-worker.js', join(root, 'dist', 'browser', 'bandshelf-worker.js')],
    // The same worker as a data script holding its source, started from a Blob URL (works from file://).
    ['assets/bandshelf-worker-source.js', join(root, 'dist', 'browser', 'bandshelf-worker-source.js')],
  ];
  const own = join(root, 'site', 'assets');
  if (existsSync(own)) {
    for (const name of readdirSync(own).sort()) list.push([`assets/${name}`, join(own, name)]);
  }
  return list;
}

/**
 * Returns the output paths written. The `//# sourceMappingURL` comments of the minified vendor files are dropped:
 * their maps are not shipped, and a browser's developer tools would otherwise request a missing file.
 */
export function copySiteAssets(root: string, out: string, options: CopySiteAssetsOptions = {}): string[] {
  const sources = assetSources(root);
  for (const [, source] of sources) {
    if (!existsSync(source)) {
      const hint = source.includes(join('dist', 'browser')) ? ' (run `npm run build` first)' : '';
      throw new BandshelfError('IO_ERROR', `a site asset is missing${hint}`, { file: source });
    }
  }
  if (options.checkOnly) return [];
  for (const [target, source] of sources) {
    const path = join(out, target);
    mkdirSync(dirname(path), { recursive: true });
    if (target.endsWith('.js')) {
      const text = readFileSync(source, 'utf8').replace(/\n?\/\/# sourceMappingURL=\S+\s*$/, '\n');
      writeFileSync(path, text);
    } else {
      writeFileSync(path, readFileSync(source));
    }
  }
  return sources.map(([target]) => target);
}
