// The built site in headless Chromium (playwright-core), served from 127.0.0.1: search, entry plots (x axis high
// → low), escaped metadata with no dialog, a match report's unexplained bands, the in-browser matcher, the derived
// downloads, and no request to any other host and no console error (a Content-Security-Policy violation is one).
// Screenshots go to test-output/screenshots/.
import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bandshelf, parseJson, ROOT } from '../cli/bandshelfCli.js';
import { browserTestsRun, launchChromium, type StaticSite, serveFolder } from './browserHarness.js';
import { buildTestLibrary, DEMO_LIBRARY, type SiteFixture, XSS_NAME, XSS_NOTES } from './siteFixture.js';

const SHOTS = join(ROOT, 'test-output', 'screenshots');

describe.skipIf(!browserTestsRun())('the site in a browser', () => {
  let fx: SiteFixture;
  let server: StaticSite;
  let browser: Browser;
  let base: string;
  const problems: string[] = [];
  const dialogs: string[] = [];

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    fx = buildTestLibrary({ demo: true });
    const out = join(fx.dir, 'site');
    const r = bandshelf(['site', '--library', fx.library, '--reports', fx.reports, '--out', out]);
    expect(r.code, r.stderr).toBe(0);
    server = await serveFolder(out);
    base = server.url;
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  async function open(path: string, viewport = { width: 1280, height: 900 }): Promise<Page> {
    const page = await browser.newPage({ viewport, acceptDownloads: true });
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning')
        problems.push(`${path}: console ${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`${path}: page error: ${e.message}`));
    page.on('dialog', (d) => {
      dialogs.push(`${path}: ${d.type()} ${d.message()}`);
      void d.dismiss();
    });
    page.on('request', (req) => {
      if (!req.url().startsWith(base) && !req.url().startsWith('blob:') && !req.url().startsWith('data:')) {
        problems.push(`${path}: request to another host: ${req.url()}`);
      }
    });
    await page.goto(new URL(path, base).href, { waitUntil: 'load' });
    return page;
  }

  async function resultIds(page: Page): Promise<string[]> {
    return page.$$eval('#search-results li a', (links) =>
      links.map((a) => (a.getAttribute('href') ?? '').replace(/\/$/, '').split('/').pop() ?? ''),
    );
  }

  it('search finds entries by band position, name, CAS number and band name as the user types', async () => {
    const page = await open('search/');
    await page.waitForSelector('#search-input[data-ready="true"]');
    await page.fill('#search-input', '1652');
    await page.waitForFunction(() => document.querySelectorAll('#search-results li').length > 0);
    const byPosition = await resultIds(page);
    // The page runs the CLI's band search over the published peaks at the CLI's default tolerance: the same hits in
    // the same order as `bandshelf bands 1652` on the library it was built from.
    const bands = parseJson<{ hits: { id: string }[] }>(
      bandshelf(['bands', '1652', '--library', fx.library, '--json']).stdout,
    );
    expect(byPosition).toContain('albumin-test');
    expect(byPosition).not.toContain('glucose-test');
    expect(byPosition).toEqual(bands.hits.map((h) => h.id));
    await page.screenshot({ path: join(SHOTS, 'search-1652.png'), fullPage: true });

    await page.fill('#search-input', 'glucose');
    await page.waitForFunction(() =>
      document.querySelector('#search-results li a')?.textContent?.includes('lucose'),
    );
    expect((await resultIds(page)).slice(0, 3)).toContain('glucose-test');
    await page.fill('#search-input', '7732-18-5');
    await page.waitForFunction(() => document.querySelectorAll('#search-results li').length > 0);
    expect(await resultIds(page)).toContain('water-test');
    await page.fill('#search-input', 'amide');
    await page.waitForFunction(() => document.querySelectorAll('#search-results li').length > 0);
    expect(await resultIds(page)).toContain('albumin-test');
    // As the user types: a prefix already finds the entry.
    await page.fill('#search-input', 'phosphatidyl');
    await page.waitForFunction(() => document.querySelectorAll('#search-results li').length > 0);
    expect(await resultIds(page)).toContain('lipid-test');
    await page.close();
  });

  it('an entry page draws its spectrum with data marks, wavenumber high → low, both traces togglable', async () => {
    const page = await open('entries/albumin-test/');
    await page.waitForSelector('#entry-plot[data-rendered="true"] svg');
    const line = await page.$$eval('#entry-plot svg .mark-line path', (paths) =>
      paths.map((p) => (p.getAttribute('d') ?? '').length),
    );
    expect(line.length).toBe(1);
    expect(line[0]).toBeGreaterThan(1000);
    // Tick labels of the x axis, left to right, must decrease.
    const ticks = await page.$$eval('#entry-plot svg .role-axis', (axes) => {
      const x = axes.find((a) => (a.getAttribute('aria-label') ?? '').startsWith('X-axis'));
      if (!x) return [];
      return Array.from(x.querySelectorAll('.role-axis-label text'))
        .map((t) => ({
          left: t.getBoundingClientRect().left,
          value: Number((t.textContent ?? '').replace(/[^0-9.]/g, '')),
        }))
        .sort((a, b) => a.left - b.left)
        .map((t) => t.value);
    });
    expect(ticks.length).toBeGreaterThan(3);
    for (let i = 1; i < ticks.length; i++) expect(ticks[i]!).toBeLessThan(ticks[i - 1]!);
    expect(ticks[0]!).toBeGreaterThanOrEqual(3600);
    expect(ticks.at(-1)!).toBeLessThanOrEqual(1000);
    await page.screenshot({ path: join(SHOTS, 'entry-albumin.png'), fullPage: true });

    await page.check('#plot-controls input[value="processed"]');
    await page.waitForFunction(
      () => document.querySelectorAll('#entry-plot svg .mark-line path').length === 2,
    );
    await page.uncheck('#plot-controls input[value="original"]');
    await page.waitForFunction(
      () => document.querySelectorAll('#entry-plot svg .mark-line path').length === 1,
    );
    await page.screenshot({ path: join(SHOTS, 'entry-albumin-processed.png') });

    // Zoom with the wheel over the plot narrows the x domain (fewer thousands between the outer ticks).
    const box = (await page.$('#entry-plot svg'))!;
    const bb = (await box.boundingBox())!;
    await page.check('#plot-controls input[value="original"]');
    await page.waitForFunction(
      () => document.querySelectorAll('#entry-plot svg .mark-line path').length === 2,
    );
    await page.mouse.move(bb.x + bb.width / 2, bb.y + bb.height / 2);
    await page.mouse.wheel(0, -600);
    await page.waitForTimeout(300);
    const zoomed = await page.$$eval('#entry-plot svg .role-axis', (axes) => {
      const x = axes.find((a) => (a.getAttribute('aria-label') ?? '').startsWith('X-axis'));
      return Array.from(x?.querySelectorAll('.role-axis-label text') ?? []).map((t) =>
        Number((t.textContent ?? '').replace(/[^0-9.]/g, '')),
      );
    });
    expect(Math.max(...zoomed) - Math.min(...zoomed)).toBeLessThan(ticks[0]! - ticks.at(-1)!);

    await page.setViewportSize({ width: 820, height: 1180 });
    await page.waitForTimeout(200);
    await page.screenshot({ path: join(SHOTS, 'entry-albumin-tablet.png'), fullPage: true });
    await page.emulateMedia({ media: 'print' });
    // Printed: no navigation, controls or export links; the caution and the plot stay.
    expect(await page.isVisible('.site-header')).toBe(false);
    expect(await page.isVisible('#plot-controls')).toBe(false);
    expect(await page.isVisible('.vega-actions')).toBe(false);
    expect(await page.isVisible('.caution')).toBe(true);
    expect(await page.isVisible('#entry-plot svg')).toBe(true);
    await page.screenshot({ path: join(SHOTS, 'entry-albumin-print.png'), fullPage: true });
    await page.close();
  });

  it("saves a plot as SVG and as PNG with vega-embed's export links", async () => {
    const page = await open('entries/albumin-test/');
    await page.waitForSelector('#entry-plot[data-rendered="true"] svg');
    const save = async (label: string) => {
      const link = page.locator(`#entry-plot .vega-actions a:text-is("${label}")`);
      // vega-embed renders the image on mousedown and points the link at it; the click then downloads it.
      await link.dispatchEvent('mousedown');
      await page.waitForFunction(
        (l) =>
          Array.from(document.querySelectorAll('#entry-plot .vega-actions a')).some(
            (a) => a.textContent === l && a.getAttribute('href') !== '#',
          ),
        label,
      );
      const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
      return { name: download.suggestedFilename(), bytes: readFileSync((await download.path())!) };
    };
    const svg = await save('Save as SVG');
    expect(svg.name).toBe('albumin-test-spectrum.svg');
    expect(svg.bytes.toString('utf8')).toMatch(/^<svg[^>]*xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    expect(svg.bytes.toString('utf8')).toContain('wavenumber');
    const png = await save('Save as PNG');
    expect(png.name).toBe('albumin-test-spectrum.png');
    // The PNG signature, 89 50 4E 47 0D 0A 1A 0A (ISO/IEC 15948, PNG specification §5.2).
    expect([...png.bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    await page.close();
  });

  it('makes the CSV and JCAMP-DX downloads with every original point', async () => {
    const page = await open('entries/albumin-test/');
    const shown = parseJson<{ original: { x: number[]; y: number[] } }>(
      bandshelf(['show', 'albumin-test', '--library', fx.library, '--json']).stdout,
    );
    const [csv] = await Promise.all([page.waitForEvent('download'), page.click('button[data-derive="csv"]')]);
    expect(csv.suggestedFilename()).toBe('albumin-test.csv');
    const lines = readFileSync((await csv.path())!, 'utf8')
      .trim()
      .split('\n');
    expect(lines[0]).toBe('wavenumber_cm-1,absorbance');
    expect(lines.length - 1).toBe(shown.original.x.length);
    expect(lines[1]).toBe(`${shown.original.x[0]},${shown.original.y[0]}`);
    const [jdx] = await Promise.all([
      page.waitForEvent('download'),
      page.click('button[data-derive="jcamp-dx"]'),
    ]);
    expect(jdx.suggestedFilename()).toBe('albumin-test.jdx');
    const text = readFileSync((await jdx.path())!, 'utf8');
    expect(text).toMatch(/^##TITLE=Serum albumin \(test\)/);
    expect(text).toContain(`##NPOINTS=${shown.original.x.length}`);
    await page.close();
  });

  it('shows the XSS entry as text and opens no dialog, on its page, in browse and in search', async () => {
    const entry = await open('entries/xss-test/');
    await entry.waitForSelector('#entry-plot[data-rendered="true"] svg');
    expect(await entry.textContent('h1')).toBe(XSS_NAME);
    const notes = await entry.$$eval('table.kv tr', (rows) =>
      rows
        .filter((r) => r.querySelector('th')?.textContent === 'Notes')
        .map((r) => r.querySelector('td')?.textContent),
    );
    expect(notes).toEqual([XSS_NOTES]);
    expect(await entry.$$('h1 img, table.kv img, table.kv script, table.kv b')).toHaveLength(0);
    await entry.screenshot({ path: join(SHOTS, 'entry-xss.png'), fullPage: true });
    await entry.close();

    const browse = await open('browse/');
    expect(await browse.textContent('#browse-table')).toContain(XSS_NAME);
    await browse.close();
    const search = await open('search/');
    await search.waitForSelector('#search-input[data-ready="true"]');
    await search.fill('#search-input', 'onerror');
    await search.waitForFunction(() => document.querySelectorAll('#search-results li').length > 0);
    expect(await search.textContent('#search-results')).toContain(XSS_NAME);
    await search.close();
    expect(dialogs).toEqual([]);
  });

  it('browse filters by class and sorts by name without a reload', async () => {
    const page = await open('browse/');
    await page.evaluate(() => {
      (window as unknown as { marker: number }).marker = 1;
    });
    await page.selectOption('select[name="class"]', 'protein');
    const visible = await page.$$eval('#browse-table tbody tr:not([hidden])', (rows) =>
      rows.map((r) => r.dataset.class),
    );
    expect(visible.length).toBeGreaterThan(1);
    expect(new Set(visible)).toEqual(new Set(['protein']));
    await page.selectOption('select[name="sort"]', 'name-desc');
    const names = await page.$$eval('#browse-table tbody tr:not([hidden])', (rows) =>
      rows.map((r) => r.dataset.name ?? ''),
    );
    expect(names).toEqual(
      [...names].sort((a, b) => b.localeCompare(a, 'en', { sensitivity: 'base', numeric: true })),
    );
    expect(await page.evaluate(() => (window as unknown as { marker?: number }).marker)).toBe(1);
    await page.screenshot({ path: join(SHOTS, 'browse-protein.png'), fullPage: true });
    await page.close();
  });

  it('a match report page shows the overlay, the residual with the unexplained bands, and the band table', async () => {
    const index = await open('reports/');
    const link = await index.$$eval('.report-list a', (as) =>
      // Links are relative to their page now; resolve against it, then open as a site path.
      as
        .map((a) => new URL((a as HTMLAnchorElement).href).pathname.slice(1))
        .find((h) => h.includes('unknown-mixture')),
    );
    expect(link).toBeTruthy();
    await index.close();
    const page = await open(link!);
    await page.waitForSelector('#report-plot[data-rendered="true"] svg');
    await page.waitForSelector('#report-residual[data-rendered="true"] svg');
    const rows = await page.$$eval('table.unexplained tbody tr td:first-child', (tds) =>
      tds.map((td) => Number(td.textContent)),
    );
    // The unknown holds a band at 1780 cm⁻¹ that no library entry has.
    expect(rows.some((p) => Math.abs(p - 1780) < 6)).toBe(true);
    // Each unexplained band is marked and labelled on the residual plot.
    const labels = await page.$$eval('#report-residual svg .mark-text.role-mark text', (ts) =>
      ts.map((t) => Number(t.textContent)),
    );
    expect(labels.sort((a, b) => a - b)).toEqual(rows.map((p) => Math.round(p)).sort((a, b) => a - b));
    const rules = await page.$$('#report-residual svg .mark-rule.role-mark line');
    expect(rules.length).toBe(2 * rows.length + 1); // in both panels, plus the residual's zero line
    expect(await page.textContent('body')).toContain('Band identification');
    await page.screenshot({ path: join(SHOTS, 'report-mixture.png'), fullPage: true });

    // At 800 px the band table fits: its last column, "Explained by the fit", ends inside the window.
    await page.setViewportSize({ width: 800, height: 900 });
    await page.waitForTimeout(200);
    const header = (await page
      .locator('table.band-table th', { hasText: 'Explained by the fit' })
      .boundingBox())!;
    expect(header.x).toBeGreaterThan(0);
    expect(header.x + header.width).toBeLessThanOrEqual(800);
    const cell = (await page
      .locator('table.band-table tbody tr >> nth=0')
      .locator('td')
      .last()
      .boundingBox())!;
    expect(cell.x + cell.width).toBeLessThanOrEqual(800);
    await page.screenshot({ path: join(SHOTS, 'report-mixture-800.png'), fullPage: true });

    // Printed: no navigation, download or export links; the caution, both plots and the tables stay.
    await page.emulateMedia({ media: 'print' });
    expect(await page.isVisible('.site-header')).toBe(false);
    expect(await page.isVisible('.report-download')).toBe(false);
    expect(await page.isVisible('.vega-actions >> nth=0')).toBe(false);
    expect(await page.isVisible('.report-caution')).toBe(true);
    expect(await page.isVisible('#report-plot svg')).toBe(true);
    expect(await page.isVisible('#report-residual svg')).toBe(true);
    expect(await page.isVisible('table.band-table')).toBe(true);
    await page.screenshot({ path: join(SHOTS, 'report-mixture-print.png'), fullPage: true });
    await page.close();
  });

  it('the in-browser matcher lists the right top hit for a dropped demo unknown, as the CLI does', async () => {
    const file = join(DEMO_LIBRARY, 'unknowns', 'u01-single-compound.csv');
    const truth = parseJson<{ unknowns: Record<string, { components: { id: string }[] }> }>(
      readFileSync(join(DEMO_LIBRARY, 'unknowns', 'truth.json'), 'utf8'),
    );
    const expected = truth.unknowns['u01-single-compound.csv']!.components[0]!.id;
    const cli = parseJson<{ hits: { id: string; score: number }[] }>(
      bandshelf(['match', file, '--library', fx.library, '--json']).stdout,
    );
    expect(cli.hits[0]!.id).toBe(expected);

    const page = await open('match/');
    await page.waitForSelector('#match-drop[data-ready="true"]');
    const dataTransfer = await page.evaluateHandle(
      ({ name, text }) => {
        const dt = new DataTransfer();
        dt.items.add(new File([text], name, { type: 'text/csv' }));
        return dt;
      },
      { name: 'u01-single-compound.csv', text: readFileSync(file, 'utf8') },
    );
    await page.dispatchEvent('#match-drop', 'drop', { dataTransfer });
    await page.waitForSelector('#match-drop[data-matched="u01-single-compound.csv"]');
    const hits = await page.$$eval('#match-report table.hits tbody tr', (trs) =>
      trs.map((tr) => ({
        id: (tr as HTMLElement).dataset.id ?? '',
        score: Number(tr.querySelector('td:nth-child(4)')?.textContent),
      })),
    );
    expect(hits[0]!.id).toBe(expected);
    // Same reader, recipe and kernels as the CLI; only the published vectors are int16-quantised.
    expect(Math.abs(hits[0]!.score - cli.hits[0]!.score)).toBeLessThan(1e-3);
    // The same pipeline as `bandshelf match --mixture`: the page shows the mixture's components and the bands.
    const cliMixture = parseJson<{ mixture: { components: { id: string }[] } }>(
      bandshelf(['match', file, '--library', fx.library, '--json', '--mixture']).stdout,
    );
    const components = await page.$$eval('#match-report table.mixture-components tbody tr', (trs) =>
      trs.map((tr) => tr.querySelector('td')?.textContent ?? ''),
    );
    expect(components.length).toBe(cliMixture.mixture.components.length);
    expect(components[0]).toContain(cliMixture.mixture.components[0]!.id);
    expect(await page.$$('#match-report table.band-table tbody tr')).not.toHaveLength(0);
    await page.screenshot({ path: join(SHOTS, 'matcher-u01.png'), fullPage: true });

    // A file that is not a spectrum gives one clear line, not a crash.
    await page.setInputFiles('#match-file', {
      name: 'notes.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('hello\nworld\n'),
    });
    await page.waitForFunction(() =>
      (document.getElementById('match-status')?.textContent ?? '').startsWith('notes.csv'),
    );
    expect(await page.textContent('#match-status')).toMatch(/^notes\.csv(:\d+)?: .*\[[A-Z_]+\]$/);
    await page.close();
  });

  it('the in-browser matcher matches a time-domain sample and reference trace pair as match --time-domain does', async () => {
    // The demo's synthetic field-resolved paracetamol traces (src/demo).
    const traces = join(DEMO_LIBRARY, 'time-domain');
    const sample = join(traces, 'paracetamol-field-resolved-sample.csv');
    const reference = join(traces, 'paracetamol-field-resolved-reference.csv');
    const cli = parseJson<{ hits: { id: string; score: number }[] }>(
      bandshelf([
        'match',
        sample,
        '--time-domain',
        '--reference',
        reference,
        '--library',
        fx.library,
        '--json',
      ]).stdout,
    );
    const page = await open('match/');
    await page.waitForSelector('#match-drop[data-ready="true"]');
    await page.setInputFiles('#match-reference', reference);
    await page.setInputFiles('#match-file', sample);
    await page.waitForSelector('#match-drop[data-matched="paracetamol-field-resolved-sample.csv"]');
    expect(await page.getAttribute('#match-drop', 'data-failed')).toBeNull();
    const hits = await page.$$eval('#match-report table.hits tbody tr', (trs) =>
      trs.map((tr) => ({
        id: (tr as HTMLElement).dataset.id ?? '',
        score: Number(tr.querySelector('td:nth-child(4)')?.textContent),
      })),
    );
    expect(hits[0]!.id).toBe(cli.hits[0]!.id);
    // Same conversion and pipeline; only the published vectors are int16-quantised.
    expect(Math.abs(hits[0]!.score - cli.hits[0]!.score)).toBeLessThan(1e-3);
    await page.close();
  });

  it('the home page lists counts and the newest revisions; no page logged an error or asked another host', async () => {
    const page = await open('');
    expect(await page.textContent('main')).toMatch(/\d+ entries/);
    await page.screenshot({ path: join(SHOTS, 'home.png'), fullPage: true });
    await page.close();
    for (const path of ['bands/', 'releases/', 'reports/']) {
      const p = await open(path);
      await p.screenshot({ path: join(SHOTS, `${path.replace(/\/$/, '')}.png`), fullPage: true });
      await p.close();
    }
    expect(problems).toEqual([]);
    expect(dialogs).toEqual([]);
  });
});
