// Browser-test helpers: Debian's Chromium through playwright-core, and a tiny static server (node:http) that serves
// a built site folder from `/` or from a sub-path, as a lab's intranet server would: files only, index.html for folders.
import { existsSync, readFileSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { extname, join, normalize, resolve } from 'node:path';
import type { Browser } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';
export const BROWSER_REQUIRED = process.env.BANDSHELF_REQUIRE_BROWSER === '1';
export const BROWSER_AVAILABLE = existsSync(CHROMIUM);

/** Prints the one skip line when Chromium is missing and not required; true when browser tests should run. */
export function browserTestsRun(): boolean {
  if (!BROWSER_AVAILABLE && !BROWSER_REQUIRED) {
    process.stdout.write(
      `browser tests skipped: ${CHROMIUM} is not installed (set BANDSHELF_REQUIRE_BROWSER=1 to fail instead)\n`,
    );
  }
  return BROWSER_AVAILABLE || BROWSER_REQUIRED;
}

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.json': 'application/json',
  '.svg': 'image/svg+xml',
  '.bin': 'application/octet-stream',
  '.f32': 'application/octet-stream',
  '.txt': 'text/plain; charset=utf-8',
};

export interface StaticSite {
  server: Server;
  /** The site's address, ending in `/` (`http://127.0.0.1:PORT/spectra/` for a sub-path). */
  url: string;
  close(): Promise<void>;
}

/** Serves `root` under `prefix` (default `/`); anything outside the prefix is 404, as on a shared intranet host. */
export async function serveFolder(root: string, options: { prefix?: string } = {}): Promise<StaticSite> {
  const prefix = options.prefix ?? '/';
  const server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://127.0.0.1').pathname);
    if (!path.startsWith(prefix)) {
      res.writeHead(404).end('not found');
      return;
    }
    let file = normalize(join(root, path.slice(prefix.length)));
    if (!file.startsWith(resolve(root))) {
      res.writeHead(403).end();
      return;
    }
    if (existsSync(file) && statSync(file).isDirectory()) file = join(file, 'index.html');
    if (!existsSync(file)) {
      res.writeHead(404).end('not found');
      return;
    }
    res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' });
    res.end(readFileSync(file));
  });
  await new Promise<void>((ok) => server.listen(0, '127.0.0.1', () => ok()));
  const port = (server.address() as AddressInfo).port;
  return {
    server,
    url: `http://127.0.0.1:${port}${prefix}`,
    close: () => new Promise<void>((ok) => server.close(() => ok())),
  };
}

/** Headless Chromium with the flags every browser test uses (no sandbox in CI containers, no background traffic). */
export async function launchChromium(): Promise<Browser> {
  if (!BROWSER_AVAILABLE) throw new Error(`${CHROMIUM} is missing and BANDSHELF_REQUIRE_BROWSER=1`);
  const { chromium } = await import('playwright-core');
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
}
