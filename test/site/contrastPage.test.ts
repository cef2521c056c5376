// A contrast report on the site: `site --reports` publishes it on a page of its own, built from the report, with the
// caution, the group means ± SD, the difference with its interval and the shaded bands (drawn in Chromium), and
// both tables; the reports index links it.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { COHORT_GRID, syntheticCohort } from '../../src/demo/syntheticCohort.js';
import { contrastGroups } from '../../src/match/contrast/contrastGroups.js';
import { CONTRAST_CAUTION } from '../../src/schema/contrastReport.js';
import { contrastPage } from '../../src/site/contrastPage.js';
import { bandshelf, ROOT, tempDir } from '../cli/bandshelfCli.js';
import { browserTestsRun, launchChromium, type StaticSite, serveFolder } from './browserHarness.js';

let dir: string;
let out: string;

/** A seeded synthetic cohort (src/demo/syntheticCohort.ts) with its 1740 cm⁻¹ band raised by 2 SD in group A. */
async function report() {
  const { a, b } = syntheticCohort(3, { n: 20, raised: 0, raisedBy: 2 });
  return contrastGroups(
    { a: { label: 'cases', spectra: a }, b: { label: 'controls', spectra: b }, grid: COHORT_GRID },
    { created: '2026-12-04T00:00:00.000Z' },
  );
}

beforeAll(async () => {
  dir = tempDir('bandshelf-contrast-site-');
  mkdirSync(join(dir, 'reports'));
  writeFileSync(join(dir, 'reports', 'cases-vs-controls.json'), JSON.stringify(await report()));
  expect(bandshelf(['init', '--library', 'lib.sqlite'], { cwd: dir }).code).toBe(0);
  out = join(dir, 'site');
  const r = bandshelf(['site', '--library', 'lib.sqlite', '--reports', 'reports', '--out', 'site'], {
    cwd: dir,
  });
  expect(r.code, r.stderr).toBe(0);
});

describe('contrast reports on the site', () => {
  it('the page model holds both tables, the plots and the caution', async () => {
    const page = contrastPage({ slug: 'x', file: 'x.json', report: await report() });
    expect(page.path).toBe('contrasts/x/');
    expect(page.caution).toBe(CONTRAST_CAUTION);
    expect(page.bands.some((b) => b.sign === 'higher in cases' && /ester C=O/.test(b.assignment))).toBe(true);
    expect(page.bandTests.find((t) => t.verdict !== '')?.centre).toBe('1740');
    const plot = JSON.parse(page.plotJson);
    expect(plot.x).toHaveLength(451);
    expect(plot.windows.length).toBeGreaterThan(0);
  });

  it('site --reports writes the page, its JSON download, and a link from the reports index', () => {
    const html = readFileSync(join(out, 'contrasts', 'cases-vs-controls', 'index.html'), 'utf8');
    expect(html).toContain('Contrast: cases vs controls');
    expect(html).toContain('a difference between groups is an association, not a diagnosis');
    expect(html).toMatch(/<td>1740<\/td>/);
    expect(html).toMatch(/higher in cases/);
    expect(existsSync(join(out, 'contrasts', 'cases-vs-controls', 'cases-vs-controls.json'))).toBe(true);
    expect(readFileSync(join(out, 'reports', 'index.html'), 'utf8')).toContain(
      'contrasts/cases-vs-controls/',
    );
  });

  describe.skipIf(!browserTestsRun())('in Chromium', () => {
    let server: StaticSite;
    let browser: Browser;
    beforeAll(async () => {
      server = await serveFolder(out);
      browser = await launchChromium();
    });
    afterAll(async () => {
      await browser?.close();
      await server?.close();
    });

    it('draws the means ± SD and the difference with its interval and shaded bands, with no console error', async () => {
      const page = await browser.newPage();
      const problems: string[] = [];
      page.on('console', (m) => {
        if (m.type() === 'error') problems.push(m.text());
      });
      page.on('pageerror', (e) => problems.push(e.message));
      await page.goto(new URL('contrasts/cases-vs-controls/', server.url).href, { waitUntil: 'load' });
      await page.waitForSelector('#contrast-means[data-rendered="true"]');
      await page.waitForSelector('#contrast-difference[data-rendered="true"]');
      // Vega draws marks as SVG or canvas; either way each plot has content of its own size.
      for (const id of ['#contrast-means', '#contrast-difference']) {
        const box = await page.locator(id).boundingBox();
        expect(box!.height).toBeGreaterThan(150);
      }
      expect(problems).toEqual([]);
      mkdirSync(join(ROOT, 'test-output', 'screenshots'), { recursive: true });
      await page.screenshot({
        path: join(ROOT, 'test-output', 'screenshots', 'contrast-page.png'),
        fullPage: true,
      });
      await page.close();
    });
  });
});
