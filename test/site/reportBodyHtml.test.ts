// reportBodyHtml: the one renderer of a report's body (report pages and the matcher). Escaping follows the HTML
// standard's five special characters in text and quoted attributes (WHATWG HTML, "Escaping a string"; common practice).
import { describe, expect, it } from 'vitest';
import { entryMarks } from '../../src/site/entryMarks.js';
import { reportBodyHtml } from '../../src/site/reportBodyHtml.js';
import type { ReportPage } from '../../src/site/types.js';

const page: ReportPage = {
  slug: 'u1',
  path: 'reports/u1/',
  file: 'u1.csv',
  title: 'Match report: <b>u1</b>',
  summary: '',
  rows: [{ label: 'File', value: 'a&b.csv' }],
  state: [{ label: 'Library', value: 'lib' }],
  revisions: '',
  hits: [
    {
      metric: 'pearson',
      rows: [
        {
          rank: 1,
          id: 'albumin',
          path: 'entries/albumin/',
          name: '<img src=x onerror=alert(1)>',
          score: '0.9876',
          extra: 'p = 0.001',
          why: [],
          marks: ['draft'],
        },
      ],
    },
  ],
  mixture: {
    r2: '0.99',
    components: [
      {
        id: 'albumin',
        path: 'entries/albumin/',
        name: 'Albumin',
        weight: '1.2',
        interval: '1.1 – 1.3',
        share: '80 %',
        how: 'added by the selection',
        significant: 'yes',
        alternatives: [{ id: 'globulin', path: null }],
      },
    ],
    forced: [],
    criterion: 'partial F',
    rule: 'rules',
    stopReason: 'no candidate passed',
    residual: 'RSS 0.1',
    unexplained: [{ position: '1780.0', height: '0.01' }],
  },
  json: { file: 'u1.json', size: '1 KB' },
  bands: [],
  caution: 'Research use only.',
  plotJson: '',
};

describe('reportBodyHtml', () => {
  it('escapes every value and links entries through the given href', () => {
    const html = reportBodyHtml(page, { href: (p) => `../../${p}` });
    expect(html).not.toContain('<img');
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(html).toContain('<h1>Match report: &lt;b&gt;u1&lt;/b&gt;</h1>');
    expect(html).toContain('<td>a&amp;b.csv</td>');
    expect(html).toContain('<a href="../../entries/albumin/">albumin</a>');
    expect(html).toContain('<span class="mark">draft</span>');
    // An alternative with no page is named, not linked; the unexplained band is listed.
    expect(html).toMatch(/<td class="ids">globulin<\/td>/);
    expect(html).toContain('<td class="num">1780.0</td>');
    expect(html).toContain('<p class="report-caution">Research use only.</p>');
  });

  it('leaves out the heading for the matcher page and points the download where it is told', () => {
    const html = reportBodyHtml(page, { heading: false, jsonHref: 'blob:x' });
    expect(html).not.toContain('<h1>');
    expect(html).toContain('href="blob:x" download="u1.json"');
  });
});

describe('entryMarks', () => {
  it('marks a draft or rejected entry and one on its own recipe; a reviewed one on the default has none', () => {
    expect(entryMarks({ reviewState: 'reviewed' })).toEqual([]);
    expect(entryMarks({ reviewState: 'draft', ownRecipe: true })).toEqual(['draft', 'recipe differs']);
    expect(entryMarks({ reviewState: 'rejected' })).toEqual(['rejected']);
  });
});
