// "Overlay with…" on an entry page, in Chromium: the choice read from the page address draws this entry's processed
// spectrum with the named ones, a new choice is written back into the address, and an unknown id is said so.
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bandshelf } from '../cli/bandshelfCli.js';
import { browserTestsRun, launchChromium, type StaticSite, serveFolder } from './browserHarness.js';
import { buildTestLibrary } from './siteFixture.js';

describe.skipIf(!browserTestsRun())('overlay with… on an entry page', () => {
  let server: StaticSite;
  let browser: Browser;
  beforeAll(async () => {
    const fx = buildTestLibrary();
    const out = join(fx.dir, 'site');
    const r = bandshelf(['site', '--library', fx.library, '--out', out]);
    expect(r.code, r.stderr).toBe(0);
    server = await serveFolder(out);
    browser = await launchChromium();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('draws the entries named in ?with=, and keeps a new choice in the address', async () => {
    const page = await browser.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(new URL('entries/albumin-test/?with=glucose-test', server.url).href, {
      waitUntil: 'load',
    });
    await page.waitForSelector('#overlay-plot[data-rendered="true"]');
    expect(await page.inputValue('#overlay-ids')).toBe('glucose-test');
    // The legend names both spectra (this entry solid, the other dashed).
    const legend = await page.locator('#overlay-plot').textContent();
    expect(legend).toMatch(/Glucose/i);
    await page.fill('#overlay-ids', 'no-such-entry');
    await page.click('#overlay-form button[type="submit"]');
    expect(new URL(page.url()).searchParams.get('with')).toBe('no-such-entry');
    await page.waitForFunction(() =>
      /no entry 'no-such-entry'/.test(document.getElementById('overlay-plot')?.textContent ?? ''),
    );
    expect(errors).toEqual([]);
    await page.close();
  });
});
