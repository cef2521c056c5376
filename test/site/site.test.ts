// The `bandshelf site` build end to end with the real CLI: offline (nothing from another host), byte-identical
// rebuilds, escaped metadata, the Content-Security-Policy, the path prefix, empty libraries, bad reports and
// output folders holding other files.
import { existsSync, mkdirSync, readdirSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bandshelf, parseJson, tempDir } from '../cli/bandshelfCli.js';
import { buildTestLibrary, listFiles, type SiteFixture, TEST_ENTRIES, XSS_NAME } from './siteFixture.js';

let fx: SiteFixture;
let out: string;

beforeAll(() => {
  fx = buildTestLibrary();
  out = join(fx.dir, 'site');
  const r = bandshelf(['site', '--library', fx.library, '--reports', fx.reports, '--out', out]);
  expect(r.code, r.stderr).toBe(0);
});

const html = () => listFiles(out).filter((f) => f.endsWith('.html'));
const css = () => listFiles(out).filter((f) => f.endsWith('.css'));
const read = (f: string) => readFileSync(join(out, f), 'utf8');

describe('the built site', () => {
  it('has every page the issue lists, entry pages under entries/<id>/', () => {
    const files = listFiles(out);
    for (const page of [
      'index.html',
      'browse/index.html',
      'search/index.html',
      'match/index.html',
      'bands/index.html',
      'releases/index.html',
      'reports/index.html',
    ]) {
      expect(files).toContain(page);
    }
    for (const e of TEST_ENTRIES) {
      expect(files).toContain(`entries/${e.id}/index.html`);
      expect(files).toContain(`entries/${e.id}/${e.id}.json`);
      expect(files).toContain(`entries/${e.id}/${e.id}.processed.f32`);
    }
    expect(files.filter((f) => /^reports\/[^/]+\/index\.html$/.test(f)).length).toBe(1);
    for (const asset of [
      'assets/vendor/vega.min.js',
      'assets/vendor/vega-lite.min.js',
      'assets/vendor/vega-embed.min.js',
      'assets/vendor/lunr.min.js',
      'assets/bandshelf-browser.js',
      'assets/site.css',
      'assets/search-index.json',
      'assets/search-matrix.bin',
    ]) {
      expect(files).toContain(asset);
    }
  });

  it('loads nothing from another host: every src, stylesheet href and CSS url() is local', () => {
    const offenders: string[] = [];
    const remote = (u: string) =>
      /^(?:[a-z][a-z0-9+.-]*:)?\/\//i.test(u.trim()) || /^(?:data|javascript):/i.test(u.trim());
    for (const f of html()) {
      const text = read(f);
      for (const m of text.matchAll(/\s(?:src|srcset|poster|data)\s*=\s*["']([^"']*)["']/gi))
        if (remote(m[1]!)) offenders.push(`${f}: ${m[0]}`);
      for (const tag of text.matchAll(/<link\b[^>]*>/gi)) {
        const href = /href\s*=\s*["']([^"']*)["']/i.exec(tag[0]);
        if (href && remote(href[1]!)) offenders.push(`${f}: ${tag[0]}`);
      }
      for (const m of text.matchAll(/<(?:iframe|frame|embed|object)\b/gi)) offenders.push(`${f}: ${m[0]}`);
      for (const m of text.matchAll(/url\(\s*['"]?([^'")]*)/gi))
        if (remote(m[1]!)) offenders.push(`${f}: ${m[0]}`);
      for (const m of text.matchAll(/@import/gi)) offenders.push(`${f}: ${m[0]}`);
    }
    for (const f of css()) {
      const text = read(f);
      for (const m of text.matchAll(/url\(\s*['"]?([^'")]*)/gi))
        if (remote(m[1]!)) offenders.push(`${f}: ${m[0]}`);
      for (const m of text.matchAll(/@import[^;]*/gi)) offenders.push(`${f}: ${m[0]}`);
    }
    expect(offenders).toEqual([]);
    // The checker itself catches what it looks for.
    expect(remote('https://cdn.example/x.js')).toBe(true);
    expect(remote('//cdn.example/x.js')).toBe(true);
    expect(remote('/assets/x.js')).toBe(false);
  });

  it('every page carries a Content-Security-Policy with only its own scripts, no unsafe-eval, and the caution', () => {
    for (const f of html()) {
      const text = read(f);
      const csp = /<meta http-equiv="Content-Security-Policy" content="([^"]+)"/.exec(text);
      expect(csp, f).not.toBeNull();
      expect(csp![1]).toContain("script-src 'self'");
      expect(csp![1]).not.toMatch(/unsafe-eval|unsafe-inline/);
      expect(text, f).toContain('candidates, not identifications');
      expect(text, f).toContain('licensed clinical practice');
      // No inline script that the policy would block: every script element either loads a file or holds data.
      for (const s of text.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)) {
        const attrs = s[1]!;
        expect(
          /\bsrc=/.test(attrs) || /type="application\/json"/.test(attrs),
          `${f}: ${s[0].slice(0, 80)}`,
        ).toBe(true);
      }
    }
  });

  it('shows metadata as text: the XSS entry is escaped everywhere', () => {
    for (const f of html()) {
      const text = read(f);
      expect(text, f).not.toContain(XSS_NAME);
      expect(text, f).not.toContain('<script>alert(2)</script>');
      expect(text, f).not.toContain('<b>bold</b>');
    }
    const page = read('entries/xss-test/index.html');
    expect(page).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(page).toContain('&quot;&gt;&lt;script&gt;alert(2)&lt;/script&gt;');
    // The JSON files hold the text unchanged (they are data, not markup).
    const json = parseJson<{ meta: { name: string } }>(read('entries/xss-test/xss-test.json'));
    expect(json.meta.name).toBe(XSS_NAME);
  });

  it('writes downloads that keep every point: the JSON original equals the stored spectrum', () => {
    const shown = parseJson<{ original: { x: number[]; y: number[] }; processed: (number | null)[] }>(
      bandshelf(['show', 'albumin-test', '--library', fx.library, '--json']).stdout,
    );
    const json = parseJson<{
      original: { x: number[]; y: number[] };
      processed: { file: string; length: number };
    }>(read('entries/albumin-test/albumin-test.json'));
    expect(json.original.x).toEqual(shown.original.x);
    expect(json.original.y).toEqual(shown.original.y);
    const bytes = readFileSync(join(out, 'entries/albumin-test', json.processed.file));
    expect(bytes.byteLength).toBe(4 * shown.processed.length);
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    for (let i = 0; i < shown.processed.length; i++) {
      const stored = shown.processed[i];
      const v = view.getFloat32(i * 4, true);
      if (stored === null || stored === undefined) expect(Number.isNaN(v)).toBe(true);
      else expect(v).toBe(Math.fround(stored));
    }
  });

  it('lists the releases with their diffs and shows the library state in the footer', () => {
    const releases = read('releases/index.html');
    expect(releases).toContain('id="release-r1"');
    for (const e of TEST_ENTRIES) expect(releases).toContain(`>${e.id}</a>`);
    expect(read('index.html')).toMatch(/working state/);
  });

  it('renders the match report with its unexplained bands and the library state', () => {
    const page = read(listFiles(out).find((f) => /^reports\/[^/]+\/index\.html$/.test(f))!);
    expect(page).toContain('Unexplained bands');
    expect(page).toMatch(/<table class="data unexplained"[\s\S]*?<td class="num">17[6-9]\d\.\d<\/td>/);
    expect(page).toContain('State key');
  });
});

describe('--at', () => {
  it('publishes the state a release froze, and says so', () => {
    const edited = bandshelf([
      'edit',
      'glucose-test',
      '--set',
      'name=Glucose, renamed',
      '--library',
      fx.library,
    ]);
    expect(edited.code, edited.stderr).toBe(0);
    const current = join(fx.dir, 'site-current');
    const released = join(fx.dir, 'site-r1');
    expect(bandshelf(['site', '--library', fx.library, '--out', current]).code).toBe(0);
    expect(bandshelf(['site', '--library', fx.library, '--out', released, '--at', 'r1']).code).toBe(0);
    const page = (dir: string) => readFileSync(join(dir, 'entries/glucose-test/index.html'), 'utf8');
    expect(page(current)).toContain('<h1>Glucose, renamed</h1>');
    expect(page(released)).toContain('<h1>D-Glucose (test)</h1>');
    expect(page(current)).toMatch(/revision 2 of/);
    expect(page(released)).toMatch(/revision 1 of/);
    expect(readFileSync(join(released, 'index.html'), 'utf8')).toContain('release r1');
    const unknown = bandshelf([
      'site',
      '--library',
      fx.library,
      '--out',
      join(fx.dir, 'site-x'),
      '--at',
      'nope',
    ]);
    expect(unknown.code).toBe(1);
    expect(unknown.stderr).toMatch(/UNKNOWN_RELEASE/);
  });
});

describe('rebuilds', () => {
  it('are byte-identical, into the same folder and into a fresh one', () => {
    const snapshot = (dir: string) =>
      new Map(listFiles(dir).map((f) => [f, readFileSync(join(dir, f)).toString('base64')]));
    const build = (dir: string) => {
      const r = bandshelf(['site', '--library', fx.library, '--reports', fx.reports, '--out', dir]);
      expect(r.code, r.stderr).toBe(0);
    };
    build(out);
    const first = snapshot(out);
    build(out);
    const fresh = join(fx.dir, 'site-2');
    build(fresh);
    for (const next of [snapshot(out), snapshot(fresh)]) {
      expect([...next.keys()]).toEqual([...first.keys()]);
      for (const [f, bytes] of first) expect(next.get(f), f).toBe(bytes);
    }
  });
});

describe('the output folder', () => {
  it('is refused when it holds files the build did not make, unless --clean', () => {
    const dir = join(fx.dir, 'busy');
    mkdirSync(dir);
    writeFileSync(join(dir, 'notes.txt'), 'mine');
    const refused = bandshelf(['site', '--library', fx.library, '--out', dir]);
    expect(refused.code).toBe(1);
    expect(refused.stderr.trim().split('\n')).toHaveLength(1);
    expect(refused.stderr).toMatch(/OUT_NOT_EMPTY/);
    expect(refused.stderr).toContain('notes.txt');
    expect(readFileSync(join(dir, 'notes.txt'), 'utf8')).toBe('mine');
    expect(existsSync(join(dir, 'index.html'))).toBe(false);
    // --clean empties only a folder an earlier site build marked as its own.
    const unmarked = bandshelf(['site', '--library', fx.library, '--out', dir, '--clean']);
    expect(unmarked.code).toBe(1);
    expect(readFileSync(join(dir, 'notes.txt'), 'utf8')).toBe('mine');
    const ours = join(fx.dir, 'ours');
    expect(bandshelf(['site', '--library', fx.library, '--out', ours]).code).toBe(0);
    writeFileSync(join(ours, 'notes.txt'), 'mine');
    const cleaned = bandshelf(['site', '--library', fx.library, '--out', ours, '--clean']);
    expect(cleaned.code, cleaned.stderr).toBe(0);
    expect(existsSync(join(ours, 'notes.txt'))).toBe(false);
    expect(existsSync(join(ours, 'index.html'))).toBe(true);
    expect(readdirSync(fx.dir).filter((n) => n.includes('bandshelf-'))).toEqual([]);
  });

  it('--clean through a link to the library folder is refused and deletes nothing', () => {
    const link = join(tempDir(), 'out');
    symlinkSync(dirname(fx.library), link);
    const before = readdirSync(dirname(fx.library)).sort();
    const r = bandshelf(['site', '--library', fx.library, '--out', link, '--clean']);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/OUT_NOT_EMPTY/);
    expect(readdirSync(dirname(fx.library)).sort()).toEqual(before);
  });

  it('is refused when a built file was changed afterwards', () => {
    const dir = join(fx.dir, 'edited');
    expect(bandshelf(['site', '--library', fx.library, '--out', dir]).code).toBe(0);
    writeFileSync(join(dir, 'index.html'), 'edited by hand');
    const refused = bandshelf(['site', '--library', fx.library, '--out', dir]);
    expect(refused.code).toBe(1);
    expect(refused.stderr).toMatch(/OUT_NOT_EMPTY/);
    expect(refused.stderr).toContain('index.html');
    expect(readFileSync(join(dir, 'index.html'), 'utf8')).toBe('edited by hand');
  });
});

describe('--base', () => {
  it('writes every link and asset relative to its page, so any sub-path and file:// work', () => {
    const dir = join(fx.dir, 'prefixed');
    const r = bandshelf(['site', '--library', fx.library, '--out', dir, '--base', '/spectra/']);
    expect(r.code, r.stderr).toBe(0);
    const page = readFileSync(join(dir, 'entries/albumin-test/index.html'), 'utf8');
    const urls = [...page.matchAll(/\s(?:href|src|data-json|data-script|data-base)="([^"#]*)"/g)].map(
      (m) => m[1]!,
    );
    expect(urls.length).toBeGreaterThan(10);
    // No root-absolute URL: an entry page two folders deep reaches the assets through ../../ (RFC 3986 §5.2).
    for (const u of urls) expect(u.startsWith('/'), u).toBe(false);
    expect(page).toContain('href="../../assets/site.css"');
    expect(page).toContain('data-base="../../"');
    // The data the page needs ships as a script beside it (browsers refuse fetch from file://, not <script>).
    expect(page).toContain('data-script="../../entries/albumin-test/albumin-test.data.js"');
    expect(readFileSync(join(dir, 'entries/albumin-test/albumin-test.data.js'), 'utf8')).toMatch(
      /^\(self\.__bandshelf=self\.__bandshelf\|\|\{\}\)\["entry:albumin-test"\]=\{"document":/,
    );
  });

  it('refuses a prefix that is not a plain path', () => {
    const r = bandshelf([
      'site',
      '--library',
      fx.library,
      '--out',
      join(fx.dir, 'bad-base'),
      '--base',
      '/a/../b',
    ]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--base.*BAD_OPTION/);
  });
});

describe('reports', () => {
  it('a report that fails its schema stops the build with one line naming the file and the field', () => {
    const dir = tempDir('bandshelf-site-badreport-');
    const good = listFiles(fx.reports).find((f) => f.endsWith('.json'))!;
    const report = parseJson<Record<string, unknown>>(readFileSync(join(fx.reports, good), 'utf8'));
    writeFileSync(join(dir, 'good.json'), JSON.stringify(report));
    const broken = { ...report, query: { ...(report.query as object), hash: 'not-a-hash' } };
    writeFileSync(join(dir, 'broken.json'), JSON.stringify(broken));
    const outDir = join(dir, 'site');
    const r = bandshelf(['site', '--library', fx.library, '--reports', dir, '--out', outDir]);
    expect(r.code).toBe(1);
    const lines = r.stderr.trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toContain('broken.json');
    expect(lines[0]).toContain('query.hash');
    expect(lines[0]).toContain('BAD_REPORT');
    expect(existsSync(outDir)).toBe(false);
  });
});

describe('privacy of the unknown', () => {
  // Every text file of a built site (pages, scripts, JSON), for a search of what must not appear anywhere.
  const textOf = (dir: string) =>
    listFiles(dir)
      .filter((f) => /\.(html|js|json|css|txt)$/.test(f))
      .map((f) => ({ f, text: readFileSync(join(dir, f), 'utf8') }));

  it('reports of unknowns given by absolute path publish the file name only, no folder of this machine', () => {
    // The fixture matched the mixture unknown by its absolute path inside fx.dir.
    expect(fx.mixtureUnknown.startsWith(fx.dir)).toBe(true);
    for (const { f, text } of textOf(out)) expect(text.includes(fx.dir), f).toBe(false);
    const page = html().find((f) => f.startsWith('reports/') && f !== 'reports/index.html')!;
    expect(read(page)).toContain('<td>unknown-mixture.csv</td>');
  });

  it('a report made with --keep-path shows the path it holds; --redact withholds name and path (hash only)', () => {
    const reports = join(fx.dir, 'kept-reports');
    mkdirSync(reports);
    const m = bandshelf([
      'match',
      fx.mixtureUnknown,
      '--library',
      fx.library,
      '--mixture',
      '--keep-path',
      '--report',
      reports,
    ]);
    expect(m.code, m.stderr).toBe(0);
    const kept = join(fx.dir, 'site-kept');
    expect(bandshelf(['site', '--library', fx.library, '--reports', reports, '--out', kept]).code).toBe(0);
    expect(textOf(kept).some(({ text }) => text.includes(fx.mixtureUnknown))).toBe(true);

    const redacted = join(fx.dir, 'site-redacted');
    const r = bandshelf([
      'site',
      '--library',
      fx.library,
      '--reports',
      reports,
      '--out',
      redacted,
      '--redact',
    ]);
    expect(r.code, r.stderr).toBe(0);
    for (const { f, text } of textOf(redacted)) {
      expect(text.includes(fx.dir), f).toBe(false);
      expect(text.includes('unknown-mixture'), f).toBe(false);
    }
    const [json] = listFiles(reports);
    const hash = parseJson<{ query: { hash: string } }>(readFileSync(join(reports, json!), 'utf8')).query
      .hash;
    // SHA-256 of the file's bytes, as sha256sum prints it (FIPS 180-4), names the report page and its address.
    const name = `unknown-${hash.slice(0, 12)}`;
    const page = readFileSync(join(redacted, 'reports', name, 'index.html'), 'utf8');
    expect(page).toContain(hash);
    expect(page).toContain('name withheld');
    expect(page).toMatch(/research use/i);
  });
});

describe('an empty library', () => {
  it('builds a site that says so', () => {
    const dir = tempDir('bandshelf-site-empty-');
    const library = join(dir, 'empty.sqlite');
    expect(bandshelf(['init', '--library', library]).code).toBe(0);
    const r = bandshelf(['site', '--library', library, '--out', join(dir, 'site'), '--json']);
    expect(r.code, r.stderr).toBe(0);
    expect(parseJson<{ entries: number }>(r.stdout).entries).toBe(0);
    const home = readFileSync(join(dir, 'site', 'index.html'), 'utf8');
    expect(home).toContain('This library has no entries yet');
    expect(readFileSync(join(dir, 'site', 'browse', 'index.html'), 'utf8')).toContain('no entries yet');
    expect(readFileSync(join(dir, 'site', 'search', 'index.html'), 'utf8')).toContain('no entries yet');
  });
});

// Last: reviews change the fixture library's state, which the byte-identical rebuilds above rely on.
describe('browse columns and report details', () => {
  const htmlText = (html: string) =>
    html
      .replace(/&lt;/g, '<')
      .replace(/&gt;/g, '>')
      .replace(/&quot;/g, '"')
      .replace(/&#39;/g, "'")
      .replace(/&amp;/g, '&');

  it('browse shows review state and coverage; a report shows forced components, stop reason, rules, intervals, its JSON', () => {
    const ok = (args: string[]) => {
      const r = bandshelf(args);
      expect(r.code, r.stderr).toBe(0);
      return r;
    };
    ok(['review', 'albumin-test', '--approve', '--reviewer', 'second person', '--library', fx.library]);
    ok(['review', 'xss-test', '--reject', '--reviewer', 'second person', '--library', fx.library]);
    const reports = join(fx.dir, 'forced-reports');
    mkdirSync(reports);
    ok([
      'match',
      fx.mixtureUnknown,
      '--library',
      fx.library,
      '--mixture',
      '--with',
      'water-test',
      '--report',
      reports,
    ]);
    const site = join(fx.dir, 'site-details');
    ok(['site', '--library', fx.library, '--reports', reports, '--out', site]);

    const browse = readFileSync(join(site, 'browse', 'index.html'), 'utf8');
    const rowOf = (id: string) => browse.split('<tr ').find((r) => r.includes(`<code>${id}</code>`)) ?? '';
    const shown = parseJson<{ coverage: { min: number; max: number } }>(
      ok(['show', 'albumin-test', '--library', fx.library, '--json']).stdout,
    );
    expect(rowOf('albumin-test')).toContain('data-review-state="reviewed"');
    expect(rowOf('albumin-test')).toContain(
      `<td class="num">${shown.coverage.max}–${shown.coverage.min}</td>`,
    );
    expect(rowOf('xss-test')).toContain('data-review-state="rejected"');
    expect(rowOf('glucose-test')).toContain('data-review-state="draft"');
    expect(browse).toMatch(/<select name="reviewState">.*<option value="rejected">/s);

    const [file] = listFiles(reports);
    const report = parseJson<{
      mixture: {
        stopReason: string;
        criterion: string;
        rule: string;
        components: { id: string; forced: boolean }[];
      };
    }>(readFileSync(join(reports, file!), 'utf8'));
    const slug = file!.replace(/\.json$/, '');
    const page = htmlText(readFileSync(join(site, 'reports', slug, 'index.html'), 'utf8'));
    expect(report.mixture.components.find((c) => c.id === 'water-test')?.forced).toBe(true);
    expect(page).toMatch(/<th scope="row">Forced in<\/th><td>water-test \(<code>--with<\/code>\)<\/td>/);
    expect(page).toContain(`<td>${report.mixture.stopReason}</td>`);
    expect(page).toContain(`<td>${report.mixture.criterion}</td>`);
    expect(page).toContain(`<p>${report.mixture.rule}</p>`);
    expect(page).toContain('95 % interval');
    expect(page).toContain('forced in (match --with)');
    expect(page).toMatch(/research use/i);
    // The download is the report document itself, beside the page.
    expect(page).toContain(`href="${slug}.json" download="${slug}.json"`);
    expect(parseJson(readFileSync(join(site, 'reports', slug, `${slug}.json`), 'utf8'))).toEqual(
      parseJson(readFileSync(join(reports, file!), 'utf8')),
    );
  });
});
