// The in-browser matcher in headless Chromium: each demo unknown dropped on the page shows the report
// `bandshelf match --json --mixture` writes for the same library (top hit, mixture component ids, unexplained band
// positions), through the report pages' renderer with its plots; the page's settings (ranges, metric, excluded
// classes, mixture off) give the CLI's flags' results; the matching runs in a worker when served, on the page (with a
// visible note) when opened from disk. The expected values are the CLI's own output, a program outside the page.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bandshelf, parseJson, ROOT } from '../cli/bandshelfCli.js';
import { browserTestsRun, launchChromium, type StaticSite, serveFolder } from './browserHarness.js';
import { buildTestLibrary, DEMO_LIBRARY, demoUnknowns, type SiteFixture } from './siteFixture.js';

const SHOTS = join(ROOT, 'test-output', 'screenshots');

interface CliReport {
  hits: { id: string; class: string }[];
  mixture: { components: { id: string }[]; residualBands: { position: number }[] } | null;
}

describe.skipIf(!browserTestsRun())('the matcher page in a browser', () => {
  let fx: SiteFixture;
  let out: string;
  let server: StaticSite;
  let browser: Browser;
  const problems: string[] = [];

  beforeAll(async () => {
    fx = buildTestLibrary({ demo: true, withReports: false });
    out = join(fx.dir, 'site');
    const r = bandshelf(['site', '--library', fx.library, '--out', out]);
    expect(r.code, r.stderr).toBe(0);
    server = await serveFolder(out);
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  async function openMatcher(url: string): Promise<Page> {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    page.on('console', (m) => {
      if (m.type() === 'error') problems.push(`console error: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
    await page.goto(url, { waitUntil: 'load' });
    await page.waitForSelector('#match-drop[data-ready="true"]');
    await page.waitForSelector('#match-drop[data-engine]');
    return page;
  }

  async function drop(page: Page, name: string): Promise<void> {
    const dataTransfer = await page.evaluateHandle(
      ({ name, text }) => {
        const dt = new DataTransfer();
        dt.items.add(new File([text], name, { type: 'text/plain' }));
        return dt;
      },
      { name, text: readFileSync(join(DEMO_LIBRARY, 'unknowns', name), 'utf8') },
    );
    await page.dispatchEvent('#match-drop', 'drop', { dataTransfer });
    await page.waitForSelector(`#match-drop[data-matched="${name}"]`);
  }

  /** What the page shows: hit ids in order, mixture component ids, unexplained band positions as printed. */
  async function shown(page: Page): Promise<{ hits: string[]; components: string[]; unexplained: string[] }> {
    const ids = (selector: string) =>
      page.$$eval(selector, (trs) => trs.map((tr) => (tr as HTMLElement).dataset.id ?? ''));
    return {
      hits: await ids('#match-report table.hits tbody tr'),
      components: await ids('#match-report table.mixture-components tbody tr'),
      unexplained: await page.$$eval('#match-report table.unexplained tbody tr td:first-child', (tds) =>
        tds.map((td) => td.textContent?.trim() ?? ''),
      ),
    };
  }

  const cli = (name: string, extra: string[] = []): CliReport =>
    parseJson<CliReport>(
      bandshelf([
        'match',
        join(DEMO_LIBRARY, 'unknowns', name),
        '--library',
        fx.library,
        '--json',
        '--mixture',
        ...extra,
      ]).stdout,
    );

  it('each demo unknown shows the CLI report: top hit, mixture components, unexplained bands, plots', async () => {
    const page = await openMatcher(`${server.url}match/`);
    // Served over http, the matching runs in the worker.
    expect(await page.getAttribute('#match-drop', 'data-engine')).toBe('worker');
    expect(await page.textContent('.report-caution')).toMatch(/research use/i);
    const names = demoUnknowns();
    expect(names.length).toBeGreaterThanOrEqual(4);
    for (const name of names) {
      const expected = cli(name);
      await drop(page, name);
      expect(await page.getAttribute('#match-drop', 'data-failed')).toBeNull();
      const got = await shown(page);
      expect(got.hits[0], name).toBe(expected.hits[0]!.id);
      expect(got.components, name).toEqual(expected.mixture!.components.map((c) => c.id));
      // The page scores the published int16-quantised vectors (the CLI the stored float32 ones), which can move a
      // residual peak's interpolated top by a few hundredths of a cm⁻¹: the same bands, each within 0.25 cm⁻¹.
      const positions = expected.mixture!.residualBands.map((b) => b.position);
      expect(got.unexplained.length, name).toBe(positions.length);
      got.unexplained.forEach((text, i) => {
        expect(Math.abs(Number(text) - positions[i]!), `${name} band ${text}`).toBeLessThanOrEqual(0.25);
      });
      await page.waitForSelector('#report-plot[data-rendered="true"] svg');
      await page.waitForSelector('#report-residual[data-rendered="true"] svg');
      expect(await page.$$('#match-report table.band-table tbody tr')).not.toHaveLength(0);
      expect(await page.textContent('#match-report .report-caution')).toMatch(/research use/i);
      await page.screenshot({
        path: join(SHOTS, `matcher-${name.replace(/\.\w+$/, '')}.png`),
        fullPage: true,
      });
    }
    // Choosing one hit for the overlay draws the unknown and that hit only.
    const second = await page.$eval(
      '#match-overlay option:nth-child(3)',
      (o) => (o as HTMLOptionElement).value,
    );
    await page.selectOption('#match-overlay', second);
    await page.waitForSelector('#report-plot[data-rendered="true"] svg');
    const legend = await page.$$eval('#report-plot svg .role-legend-label text', (ts) =>
      ts.map((t) => t.textContent ?? ''),
    );
    expect(legend).toHaveLength(2);
    await page.close();
    expect(problems).toEqual([]);
  });

  it('ranges, metric, excluded classes and mixture off give what the same CLI flags give', async () => {
    const name = 'u01-single-compound.csv';
    const plain = cli(name);
    const leftOut = plain.hits[0]!.class;
    const expected = cli(name, ['--range', '1800:900', '--metric', 'cosine', '--exclude-class', leftOut]);
    const page = await openMatcher(`${server.url}match/`);
    await page.fill('#match-ranges', '1800:900');
    await page.selectOption('#match-metric', 'cosine');
    await page.check(`#match-exclude input[value="${leftOut}"]`);
    await drop(page, name);
    const got = await shown(page);
    expect(got.hits).toEqual(expected.hits.map((h) => h.id));
    expect(got.components).toEqual(expected.mixture!.components.map((c) => c.id));
    expect(await page.textContent('#match-report')).toContain('Top hits · cosine');
    expect(await page.textContent('#match-report')).toContain('1800–900 cm⁻¹');

    // Mixture off: hits and bands, no mixture section (as `match` without --mixture).
    await page.uncheck('#match-mixture-on');
    await page.waitForFunction(
      () => document.querySelector('#match-report table.mixture-components') === null,
    );
    await page.waitForSelector(`#match-drop[data-matched="${name}"]`);
    expect(await page.$$('#match-report table.hits tbody tr')).not.toHaveLength(0);

    // A malformed range gives one line naming the field, not a crash.
    await page.fill('#match-ranges', '1800');
    await page.dispatchEvent('#match-ranges', 'change');
    await page.waitForSelector('#match-drop[data-failed="true"]');
    expect(await page.textContent('#match-status')).toMatch(/range: a scoring range takes .*\[BAD_OPTION\]$/);
    await page.close();
    expect(problems).toEqual([]);
  });

  it('a time-domain sample and reference trace pair gives the report of match --time-domain --reference', async () => {
    // The expected report is the CLI's, on the same release; both read the traces through readTraceSpectrum.
    const traces = join(DEMO_LIBRARY, 'time-domain');
    const cases = [
      {
        samples: ['paracetamol-field-resolved-sample.csv'],
        references: ['paracetamol-field-resolved-reference.csv'],
      },
      {
        samples: ['glucose-field-resolved-sample-1.csv', 'glucose-field-resolved-sample-2.csv'],
        references: ['glucose-field-resolved-reference-1.csv', 'glucose-field-resolved-reference-2.csv'],
      },
    ];
    const page = await openMatcher(`${server.url}match/`);
    for (const { samples, references } of cases) {
      const expected = parseJson<CliReport & { query: { file: string; hash: string } }>(
        bandshelf([
          'match',
          ...samples.map((f) => join(traces, f)),
          '--time-domain',
          ...references.flatMap((f) => ['--reference', join(traces, f)]),
          '--library',
          fx.library,
          '--json',
          '--mixture',
        ]).stdout,
      );
      await page.setInputFiles(
        '#match-reference',
        references.map((f) => join(traces, f)),
      );
      const dataTransfer = await page.evaluateHandle(
        (files) => {
          const dt = new DataTransfer();
          for (const f of files) dt.items.add(new File([f.text], f.name, { type: 'text/plain' }));
          return dt;
        },
        samples.map((name) => ({ name, text: readFileSync(join(traces, name), 'utf8') })),
      );
      await page.dispatchEvent('#match-drop', 'drop', { dataTransfer });
      await page.waitForSelector(`#match-drop[data-matched="${samples[0]}"]`);
      expect(
        await page.getAttribute('#match-drop', 'data-failed'),
        (await page.textContent('#match-status')) ?? '',
      ).toBeNull();
      const got = await shown(page);
      expect(got.hits.slice(0, 3), samples[0]).toEqual(expected.hits.slice(0, 3).map((h) => h.id));
      expect(got.components, samples[0]).toEqual(expected.mixture!.components.map((c) => c.id));
      // The downloaded report names the same file and hash (the samples' bytes, then the references').
      const [download] = await Promise.all([
        page.waitForEvent('download'),
        page.click('#match-report .report-download a'),
      ]);
      const query = (
        JSON.parse(readFileSync((await download.path())!, 'utf8')) as {
          query: { file: string; hash: string };
        }
      ).query;
      expect(query.file).toBe(expected.query.file);
      expect(query.hash).toBe(expected.query.hash);
    }
    await page.screenshot({ path: join(SHOTS, 'matcher-time-domain.png'), fullPage: true });
    await page.close();
    expect(problems).toEqual([]);
  }, 240_000);

  it('opened from disk, the page still matches in a background worker (started from a Blob URL)', async () => {
    const page = await openMatcher(pathToFileURL(join(out, 'match', 'index.html')).href);
    // Chromium refuses `new Worker()` of a file:// script (origin 'null') but runs one from a Blob URL (checked in
    // Chromium 156 by hand, 2026-12-04): the page must not fall back to its own thread.
    expect(await page.getAttribute('#match-drop', 'data-engine')).toBe('worker');
    expect(await page.textContent('#match-engine')).toMatch(/background worker: the page stays responsive/);
    const name = 'u02-spiked-mixture.jdx';
    await drop(page, name);
    expect((await shown(page)).hits[0]).toBe(cli(name).hits[0]!.id);
    await page.screenshot({ path: join(SHOTS, 'matcher-file-url.png'), fullPage: true });
    await page.close();
  });
});
