// The HTML of one match report (a ReportPage): the one renderer of the report pages (Eleventy) and the in-browser matcher.
import type { ReportPage } from './types.js';

export interface ReportBodyHtmlOptions {
  /** The link to a site path (`entries/x/`, `reports/`) from the page the HTML sits on.
   * @default the path itself */
  href?: (sitePath: string) => string;
  /** Print the breadcrumb and the page's h1 (the matcher page has its own).
   * @default true */
  heading?: boolean;
  /** Where the "download the report as JSON" link points (the matcher passes a blob: URL).
   * @default page.json.file (the JSON file beside the report page) */
  jsonHref?: string;
}

const ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Text for HTML content or a quoted attribute value. */
function esc(value: string | number): string {
  return String(value).replace(/[&<>"']/g, (c) => ESCAPES[c]!);
}

type Href = (sitePath: string) => string;

/** The entry id, linked to its page where the site has one. */
function entryLink(id: string, path: string | null, href: Href): string {
  return path ? `<a href="${esc(href(path))}">${esc(id)}</a>` : esc(id);
}

function kvRows(rows: { label: string; value: string }[]): string {
  return rows.map((r) => `<tr><th scope="row">${esc(r.label)}</th><td>${esc(r.value)}</td></tr>`).join('');
}

function plotSection(page: ReportPage): string {
  if (!page.plotJson) return '';
  return `<section aria-labelledby="overlay-title" class="plot-section">
  <h2 id="overlay-title">The unknown and its top hits</h2>
  <div class="plot" id="report-plot" data-download="${esc(page.slug)}-overlay" role="figure" aria-label="The unknown overlaid with its top hits"></div>
  <div class="plot" id="report-residual" data-download="${esc(page.slug)}-residual" role="figure" aria-label="Mixture fit and its residual, unexplained bands marked"></div>
  <p class="muted plot-help">Wavenumber runs high → low. Drag to pan, scroll to zoom, double-click to reset; each plot saves as an image from its “Save as SVG” and “Save as PNG” links.</p>
  <script type="application/json" id="report-plot-data">${page.plotJson}</script>
</section>
`;
}

function hitSections(page: ReportPage, href: Href): string {
  return page.hits
    .map((group, i) => {
      const rows = group.rows
        .map((h) => {
          const why =
            h.why.length === 0
              ? ''
              : `<span class="why" role="img" aria-label="share of the score by region">${h.why
                  .map(
                    (w) =>
                      `<span class="why-part why-w${Math.round(w.percent / 5) * 5}${w.negative ? ' why-neg' : ''}" title="${esc(w.title)}"></span>`,
                  )
                  .join('')}</span>`;
          const marks = h.marks.map((m) => ` <span class="mark">${esc(m)}</span>`).join('');
          return `
      <tr data-id="${esc(h.id)}"><td class="num">${h.rank}</td><td>${entryLink(h.id, h.path, href)}</td><td>${esc(h.name)}${marks}</td><td class="num">${esc(h.score)}</td><td>${esc(h.extra)}${why}</td></tr>`;
        })
        .join('');
      return `
<section aria-labelledby="hits-${i + 1}" class="report-hits">
  <h2 id="hits-${i + 1}">Top hits · ${esc(group.metric)}</h2>
  <div class="table-scroll">
  <table class="data hits">
    <thead><tr><th scope="col" class="num">Rank</th><th scope="col">Entry</th><th scope="col">Name</th><th scope="col" class="num">Score</th><th scope="col">Standing</th></tr></thead>
    <tbody>${rows}
    </tbody>
  </table>
  </div>
</section>`;
    })
    .join('');
}

function mixtureSection(mixture: NonNullable<ReportPage['mixture']>, href: Href): string {
  const forced =
    mixture.forced.length > 0 ? `${esc(mixture.forced.join(', '))} (<code>--with</code>)` : 'none';
  const components = mixture.components
    .map((c) => {
      const alternatives =
        c.alternatives.length === 0
          ? '–'
          : c.alternatives.map((a) => entryLink(a.id, a.path, href)).join(', ');
      return `
      <tr data-id="${esc(c.id)}"><td>${entryLink(c.id, c.path, href)}</td><td>${esc(c.name)}</td><td class="num">${esc(c.weight)}</td><td class="num">${esc(c.interval)}</td><td>${esc(c.significant)}</td><td class="num">${esc(c.share)}</td><td class="ids">${alternatives}</td><td>${esc(c.how)}</td></tr>`;
    })
    .join('');
  const unexplained =
    mixture.unexplained.length === 0
      ? `
  <p>The residual has no band above the noise threshold.</p>`
      : `
  <table class="data unexplained" aria-labelledby="unexplained-title">
    <thead><tr><th scope="col" class="num">Position / cm⁻¹</th><th scope="col" class="num">Height</th></tr></thead>
    <tbody>${mixture.unexplained.map((b) => `<tr><td class="num">${esc(b.position)}</td><td class="num">${esc(b.height)}</td></tr>`).join('')}
    </tbody>
  </table>`;
  return `
<section aria-labelledby="mixture-title" class="report-mixture">
  <h2 id="mixture-title">Mixture fit</h2>
  <p>R² = ${esc(mixture.r2)}</p>
  <table class="kv mixture-rule"><tbody>
    <tr><th scope="row">Forced in</th><td>${forced}</td></tr>
    <tr><th scope="row">Stopped</th><td>${esc(mixture.stopReason)}</td></tr>
    <tr><th scope="row">Rule</th><td>${esc(mixture.criterion)}</td></tr>
    <tr><th scope="row">Residual</th><td>${esc(mixture.residual)}</td></tr>
  </tbody></table>
  <details class="mixture-rule-text"><summary>The fit's rules in full</summary><p>${esc(mixture.rule)}</p></details>
  <div class="table-scroll">
  <table class="data mixture-components">
    <thead><tr><th scope="col">Component</th><th scope="col">Name</th><th scope="col" class="num">Weight</th><th scope="col" class="num">95 % interval</th><th scope="col">Significant</th><th scope="col" class="num">Share of fitted signal (95 % interval)</th><th scope="col">Not told apart from (it names one of the group)</th><th scope="col">How</th></tr></thead>
    <tbody>${components}
    </tbody>
  </table>
  </div>
  <h3 id="unexplained-title">Unexplained bands</h3>${unexplained}
</section>`;
}

function bandSection(page: ReportPage, href: Href): string {
  if (page.bands.length === 0) return '';
  const rows = page.bands
    .map(
      (b) => `
      <tr>
        <td class="num">${esc(b.position)}</td><td class="num">${esc(b.height)}</td><td class="num">${esc(b.width)}</td><td>${esc(b.kind)}</td>
        <td>${b.assignments.map((a) => `<div>${esc(a.label)} <span class="muted">(${esc(a.class)}; ${esc(a.source)})</span></div>`).join('')}</td>
        <td class="ids">${b.candidates.map((c) => entryLink(c.id, c.path, href)).join(', ')}</td>
        <td>${esc(b.explained)}</td>
      </tr>`,
    )
    .join('');
  return `
<section aria-labelledby="bands-title" class="report-bands">
  <h2 id="bands-title">Band identification</h2>
  <div class="table-scroll">
  <table class="data band-table">
    <thead><tr><th scope="col" class="num">Position / cm⁻¹</th><th scope="col" class="num">Height</th><th scope="col" class="num">Width / cm⁻¹</th><th scope="col">Kind</th><th scope="col">Assignments (source)</th><th scope="col">Library entries with a band here</th><th scope="col">Explained by the fit</th></tr></thead>
    <tbody>${rows}
    </tbody>
  </table>
  </div>
</section>`;
}

export function reportBodyHtml(page: ReportPage, options: ReportBodyHtmlOptions = {}): string {
  const href = options.href ?? ((p: string) => p);
  const jsonHref = options.jsonHref ?? page.json.file;
  const heading =
    options.heading === false
      ? ''
      : `<p class="breadcrumb"><a href="${esc(href('reports/'))}">Match reports</a> › <code>${esc(page.file)}</code></p>
<h1>${esc(page.title)}</h1>
`;
  const revisions = page.revisions
    ? `
  <details class="revision-set"><summary>The revision set searched</summary><p>${esc(page.revisions)}</p></details>`
    : '';
  return `<article class="report">
${heading}<p class="report-caution">${esc(page.caution)}</p>
<p class="report-download"><a href="${esc(jsonHref)}" download="${esc(page.json.file)}" type="application/json">Download the report as JSON</a> <span class="muted">(${esc(page.json.size)}; the document <code>bandshelf match --json</code> prints)</span></p>

<div class="two-col">
<section aria-labelledby="query-title">
  <h2 id="query-title">The unknown</h2>
  <table class="kv"><tbody>${kvRows(page.rows)}
  </tbody></table>
</section>
<section aria-labelledby="state-title">
  <h2 id="state-title">Library state</h2>
  <table class="kv"><tbody>${kvRows(page.state)}
  </tbody></table>${revisions}
</section>
</div>

${plotSection(page)}${hitSections(page, href)}
${page.mixture ? mixtureSection(page.mixture, href) : ''}
${bandSection(page, href)}
</article>
`;
}
