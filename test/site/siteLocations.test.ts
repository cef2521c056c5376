// One built demo site opened three ways in headless Chromium: served from `/`, served from the sub-path `/spectra/`,
// and opened from disk (file://). In each: the stylesheet applies, the caution shows, links from the home page reach
// browse and an entry page, the band search returns the CLI's hits and the matcher the CLI's top hit, and no page
// logs an error or asks another host. Screenshots go to test-output/screenshots/.
import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bandshelf, parseJson, ROOT } from '../cli/bandshelfCli.js';
import { browserTestsRun, launchChromium, type StaticSite, serveFolder } from './browserHarness.js';
import { buildTestLibrary, DEMO_LIBRARY, listFiles, type SiteFixture } from './siteFixture.js';

const SHOTS = join(ROOT, 'test-output', 'screenshots');
const UNKNOWN = 'u01-single-compound.csv';

describe.skipIf(!browserTestsRun())(
  'one built site, served from /, from /spectra/ and opened from disk',
  () => {
    let fx: SiteFixture;
    let out: string;
    let browser: Browser;
    let atRoot: StaticSite;
    let atSubPath: StaticSite;
    let cliBands: string[];
    let cliTop: string;
    const problems: string[] = [];

    beforeAll(async () => {
      mkdirSync(SHOTS, { recursive: true });
      fx = buildTestLibrary({ demo: true });
      out = join(fx.dir, 'site');
      const r = bandshelf(['site', '--library', fx.library, '--reports', fx.reports, '--out', out]);
      expect(r.code, r.stderr).toBe(0);
      atRoot = await serveFolder(out);
      atSubPath = await serveFolder(out, { prefix: '/spectra/' });
      browser = await launchChromium();
      cliBands = parseJson<{ hits: { id: string }[] }>(
        bandshelf(['bands', '1652', '--library', fx.library, '--json']).stdout,
      ).hits.map((h) => h.id);
      cliTop = parseJson<{ hits: { id: string }[] }>(
        bandshelf(['match', join(DEMO_LIBRARY, 'unknowns', UNKNOWN), '--library', fx.library, '--json'])
          .stdout,
      ).hits[0]!.id;
    });

    afterAll(async () => {
      await browser?.close();
      await atRoot?.close();
      await atSubPath?.close();
    });

    it('--base /spectra/ writes the same files as a build for /: one folder serves every path', () => {
      const prefixed = join(fx.dir, 'site-spectra');
      const r = bandshelf([
        'site',
        '--library',
        fx.library,
        '--reports',
        fx.reports,
        '--out',
        prefixed,
        '--base',
        '/spectra/',
      ]);
      expect(r.code, r.stderr).toBe(0);
      const files = listFiles(out);
      expect(listFiles(prefixed)).toEqual(files);
      for (const f of files.filter((name) => name.endsWith('.html'))) {
        expect(readFileSync(join(prefixed, f), 'utf8'), f).toBe(readFileSync(join(out, f), 'utf8'));
      }
    });

    const ways: { name: string; home: () => string; allowed: () => string }[] = [
      { name: 'served from /', home: () => atRoot.url, allowed: () => atRoot.url },
      { name: 'served from /spectra/', home: () => atSubPath.url, allowed: () => atSubPath.url },
      {
        name: 'opened from disk',
        home: () => pathToFileURL(join(out, 'index.html')).href,
        allowed: () => `${pathToFileURL(out).href}/`,
      },
    ];

    async function open(url: string, allowed: string, label: string): Promise<Page> {
      const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
      page.on('console', (m) => {
        if (m.type() === 'error' || m.type() === 'warning') problems.push(`${label}: console: ${m.text()}`);
      });
      page.on('pageerror', (e) => problems.push(`${label}: page error: ${e.message}`));
      page.on('request', (req) => {
        const u = req.url();
        if (!u.startsWith(allowed) && !u.startsWith('blob:') && !u.startsWith('data:')) {
          problems.push(`${label}: request outside the site: ${u}`);
        }
      });
      page.on('response', (res) => {
        if (res.status() >= 400) problems.push(`${label}: ${res.status()} for ${res.url()}`);
      });
      await page.goto(url, { waitUntil: 'load' });
      return page;
    }

    /** The stylesheet applied: the caution band has site.css's background (#fff4dc), not the browser's transparent. */
    async function expectStyled(page: Page): Promise<void> {
      const bg = await page.$eval('.caution', (el) => getComputedStyle(el).backgroundColor);
      expect(bg).toBe('rgb(255, 244, 220)');
      expect(await page.textContent('.caution')).toMatch(/research use/i);
    }

    for (const way of ways) {
      it(`${way.name}: styles, links to browse and an entry, band search and the matcher work`, async () => {
        const label = way.name;
        const slug = label.replace(/[^a-z]+/g, '-');
        const page = await open(way.home(), way.allowed(), label);
        await expectStyled(page);
        await page.screenshot({ path: join(SHOTS, `location-${slug}home.png`) });

        // Home → browse by the navigation link, then browse → an entry page by the table's link.
        await Promise.all([
          page.waitForURL(/browse\/(index\.html)?$/),
          page.click('nav a:text-is("Browse")'),
        ]);
        await expectStyled(page);
        expect(await page.$$('#browse-table tbody tr')).not.toHaveLength(0);
        await Promise.all([
          page.waitForURL(/entries\/albumin-test\/(index\.html)?$/),
          page.click('#browse-table a:text-is("Serum albumin (test)")'),
        ]);
        await expectStyled(page);
        expect(await page.textContent('h1')).toBe('Serum albumin (test)');
        // The entry's data comes from its script file, so the plot draws from disk too.
        await page.waitForSelector('#entry-plot[data-rendered="true"] svg');

        // Entry → home by the brand link, home → search by the card link; the band search is the CLI's.
        await Promise.all([page.waitForURL((u) => !u.href.includes('entries/')), page.click('a.brand')]);
        await Promise.all([
          page.waitForURL(/search\/(index\.html)?$/),
          page.click('.cards a:text-is("Search")'),
        ]);
        await expectStyled(page);
        await page.waitForSelector('#search-input[data-ready="true"]');
        await page.fill('#search-input', '1652');
        await page.waitForFunction(() => document.querySelectorAll('#search-results li').length > 0);
        const ids = await page.$$eval('#search-results li a', (links) =>
          links.map((a) => (a.getAttribute('href') ?? '').replace(/(index\.html)?$/, '').replace(/\/$/, '')),
        );
        expect(ids.map((h) => h.split('/').pop())).toEqual(cliBands);
        // A hit's link opens its entry page in this location too.
        await Promise.all([
          page.waitForURL(/entries\/[^/]+\/(index\.html)?$/),
          page.click('#search-results li a >> nth=0'),
        ]);
        expect(await page.textContent('h1')).toBeTruthy();

        // The matcher: the dropped demo unknown's top hit is the CLI's.
        await page.goto(
          new URL(way.home().endsWith('index.html') ? 'match/index.html' : 'match/', way.home()).href,
        );
        await expectStyled(page);
        await page.waitForSelector('#match-drop[data-ready="true"]');
        const dataTransfer = await page.evaluateHandle(
          ({ name, text }) => {
            const dt = new DataTransfer();
            dt.items.add(new File([text], name, { type: 'text/csv' }));
            return dt;
          },
          { name: UNKNOWN, text: readFileSync(join(DEMO_LIBRARY, 'unknowns', UNKNOWN), 'utf8') },
        );
        await page.dispatchEvent('#match-drop', 'drop', { dataTransfer });
        await page.waitForSelector(`#match-drop[data-matched="${UNKNOWN}"]`);
        const top = await page.$eval(
          '#match-report table.hits tbody tr',
          (el) => (el as HTMLElement).dataset.id ?? '',
        );
        expect(top).toBe(cliTop);
        await page.screenshot({ path: join(SHOTS, `location-${slug}match.png`), fullPage: true });
        await page.close();
        expect(problems).toEqual([]);
      });
    }
  },
);
