// Builds the page model of one match report: the unknown, the library state, hits, mixture, bands and plot data.
import type { MatchReport } from '../schema/matchReport.js';
import { gridAxis } from '../spectrum/gridAxis.js';
import { byteSize } from './byteSize.js';
import { formatNumber } from './formatNumber.js';
import { jsonForScript } from './jsonForScript.js';
import { plotTrace } from './plotTrace.js';
import type { ReportPage, ReportPlotData, ReportPlotSeries, SiteReport, SiteRow } from './types.js';

export interface ReportPageOptions {
  /** Entry id → site path segment, to link hits to entry pages.
   * @default empty (no links) */
  slugs?: Map<string, string>;
  /** The report's URL segment.
   * @default report.slug */
  slug?: string;
  /** Processed vector of an entry at a revision, from the state the site shows; undefined when that revision is
   * not in it (the hit is then not overlaid, rather than overlaid with other data).
   * @default () => undefined */
  vector?: (id: string, revision: number) => ArrayLike<number> | undefined;
  /** How many hits the overlay draws.
   * @default 3 */
  overlayHits?: number;
  /** The hits the overlay draws, by id, in place of the first `overlayHits` (the matcher's chosen hit).
   * @default the first overlayHits hits */
  overlayIds?: readonly string[];
  /** Cautions shown beside a hit's name ('draft', 'recipe differs').
   * @default () => [] */
  marks?: (id: string, revision: number) => string[];
  /** Largest number of points per plotted line.
   * @default 900 */
  maxPlotPoints?: number;
  /** Size in bytes of the report's JSON file written beside the page.
   * @default 0 */
  jsonBytes?: number;
}

function toFloat64(values: ArrayLike<number | null>): Float64Array {
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    out[i] = typeof v === 'number' && Number.isFinite(v) ? v : Number.NaN;
  }
  return out;
}

/** The file name without its folders (reports keep the path as the user typed it). */
function baseName(path: string): string {
  return path.split(/[\\/]/).pop() || path;
}

function rangeText(min: number, max: number): string {
  return `${formatNumber(max, { decimals: 0 })}–${formatNumber(min, { decimals: 0 })} cm⁻¹`;
}

export function reportPage(site: SiteReport, options: ReportPageOptions = {}): ReportPage {
  const r = site.report;
  const slugs = options.slugs ?? new Map<string, string>();
  const pathOf = (id: string): string | null => {
    const s = slugs.get(id);
    return s === undefined ? null : `entries/${s}/`;
  };
  const slug = options.slug ?? site.slug;
  const q = r.query;

  const rows: SiteRow[] = [
    {
      label: 'File',
      value: site.redacted
        ? `name withheld (site --redact); shown as ${q.file}, known by its SHA-256`
        : q.file,
    },
  ];
  if (q.title) rows.push({ label: 'Title', value: q.title });
  if (q.block !== undefined) rows.push({ label: 'Block', value: String(q.block) });
  if (q.column !== undefined) rows.push({ label: 'Column', value: q.column });
  rows.push({ label: 'SHA-256', value: q.hash });
  rows.push({
    label: 'Recipe',
    value: q.recipeSource === 'library' ? "the library's default" : 'from a file',
  });
  rows.push({
    label: 'Scoring ranges',
    value: q.ranges.length === 0 ? 'the whole grid' : q.ranges.map((w) => rangeText(w.min, w.max)).join(', '),
  });
  if (q.coverage) {
    rows.push({
      label: 'Coverage',
      value: `${rangeText(q.coverage.min, q.coverage.max)}, ${formatNumber(q.coverage.overlap, { decimals: 0 })} cm⁻¹ used`,
    });
  }
  for (const w of q.warnings) rows.push({ label: 'Warning', value: w });
  rows.push({ label: 'Standing of the best hit', value: r.standing.text });

  const state: SiteRow[] = [
    { label: 'Library', value: r.library.name },
    { label: 'Release', value: r.library.release ?? 'working state (not a release)' },
    { label: 'State key', value: r.library.stateKey },
    { label: 'Entries searched', value: String(r.library.entries) },
  ];
  const revisions = r.library.revisions
    ? r.library.revisions.map((v) => `${v.id}@${v.revision}`).join(', ')
    : '';

  const whyBar = (
    c: MatchReport['hits'][number]['contributions'],
  ): ReportPage['hits'][number]['rows'][number]['why'] => {
    const total = (c ?? []).reduce((sum, x) => sum + Math.abs(x.share), 0);
    return total > 0
      ? c!.map((x) => ({
          label: x.label,
          percent: Math.round((1000 * Math.abs(x.share)) / total) / 10,
          negative: x.share < 0,
          title: `${x.label}: ${formatNumber(x.share, { significant: 2 })} of r`,
        }))
      : [];
  };
  const metrics = r.metrics.length > 0 ? r.metrics : ['pearson' as const];
  const hits: ReportPage['hits'] = metrics.map((metric, i) => {
    const list = r.hitsByMetric[metric] ?? (i === 0 ? r.hits : []);
    return {
      metric,
      rows: list.map((h) => {
        const extras: string[] = [];
        if (h.pValue !== null) extras.push(`p = ${formatNumber(h.pValue, { significant: 2 })}`);
        if (h.z !== null) extras.push(`z = ${formatNumber(h.z, { significant: 3 })}`);
        if (h.gapToNext !== null)
          extras.push(`lead over next ${formatNumber(h.gapToNext, { significant: 3 })}`);
        extras.push(`overlap ${formatNumber(h.overlap, { decimals: 0 })} cm⁻¹`);
        return {
          rank: h.rank,
          id: h.id,
          path: pathOf(h.id),
          name: h.name,
          score: formatNumber(h.score, { decimals: 4 }),
          extra: extras.join(', '),
          why: whyBar(h.contributions),
          marks: options.marks?.(h.id, h.revision) ?? [],
        };
      }),
    };
  });

  const m = r.mixture;
  const mixture: ReportPage['mixture'] = m
    ? {
        r2: formatNumber(m.r2, { decimals: 4 }),
        components: m.components.map((c) => ({
          id: c.id,
          path: pathOf(c.id),
          name: `${c.name ?? ''}${c.forced ? ' (forced in)' : ''}`,
          weight: formatNumber(c.weight),
          interval: `${formatNumber(c.interval95[0])} – ${c.interval95[1] === null ? '∞' : formatNumber(c.interval95[1])}`,
          share: `${formatNumber(c.share * 100, { decimals: 1 })} % (${formatNumber(c.shareInterval95[0] * 100, { decimals: 1 })} – ${formatNumber(c.shareInterval95[1] * 100, { decimals: 1 })} %)`,
          how: c.forced
            ? 'forced in (match --with)'
            : `added by the selection, −${formatNumber(100 * (c.improvement ?? 0), { decimals: 1 })} % RSS` +
              (c.pValue === null ? '' : `, p = ${formatNumber(c.pValue, { significant: 2 })}`),
          significant: c.significant ? 'yes' : 'no (the interval reaches 0)',
          alternatives: (c.alternatives ?? []).map((id) => ({ id, path: pathOf(id) })),
        })),
        forced: m.components.filter((c) => c.forced).map((c) => c.id),
        criterion: m.criterion,
        rule: m.rule,
        stopReason: m.stopReason,
        residual:
          `RSS ${formatNumber(m.rss, { significant: 3 })}; noise σ ${formatNumber(m.noise, { significant: 3 })} ` +
          `(${m.noiseSource === 'band-free-window' ? 'from a band-free window' : 'from residual differences'}); ` +
          `${m.misfitBands.length === 0 ? 'no misfit on a fitted band' : `misfit on fitted bands at ${m.misfitBands.map((b) => `${formatNumber(b.position, { decimals: 0 })} (${b.component})`).join(', ')} cm⁻¹`}`,
        unexplained: m.residualBands.map((b) => ({
          position: formatNumber(b.position, { decimals: 1 }),
          height: formatNumber(b.height),
        })),
      }
    : null;

  const bands: ReportPage['bands'] = r.bands.map((b) => ({
    position: formatNumber(b.position, { decimals: 1 }),
    height: formatNumber(b.height),
    width: formatNumber(b.fwhm, { decimals: 1 }),
    kind: b.kind,
    assignments: b.assignments.map((a) => ({ label: a.label, class: a.class.join(', '), source: a.source })),
    candidates: b.candidates.map((c) => ({ id: c.id, path: pathOf(c.id) })),
    explained: b.explained === null ? 'no fit made' : b.explained ? 'yes' : 'no',
  }));

  const axis = gridAxis(q.grid);
  const maxPoints = options.maxPlotPoints ?? 900;
  const series = (name: string, role: string, values: ArrayLike<number | null>): ReportPlotSeries | null => {
    if (values.length !== axis.length) return null;
    const trace = plotTrace(axis, toFloat64(values), { maxPoints });
    return trace ? { name, role, ...trace } : null;
  };
  const unknown = series(`unknown: ${q.title ?? baseName(q.file)}`, 'unknown', q.processed);
  let plotJson = '';
  if (unknown) {
    const overlay: ReportPlotSeries[] = [unknown];
    const chosen = options.overlayIds
      ? r.hits.filter((h) => options.overlayIds!.includes(h.id))
      : r.hits.slice(0, options.overlayHits ?? 3);
    for (const h of chosen) {
      const v = options.vector?.(h.id, h.revision);
      const s = v ? series(`${h.rank}. ${h.name || h.id}`, 'hit', v) : null;
      if (s) overlay.push(s);
    }
    const fitted = m ? series('mixture fit', 'fit', m.fitted) : null;
    const residual = m ? series('residual', 'residual', m.residual) : null;
    const data: ReportPlotData = {
      overlay,
      mixture: fitted && residual ? [unknown, fitted, residual] : [],
      unexplained: m ? m.residualBands.map((b) => b.position) : [],
    };
    plotJson = jsonForScript(data);
  }

  const top = r.hits[0];
  const summary = [
    top
      ? `top hit ${top.name || top.id} (${formatNumber(top.score, { decimals: 3 })}, ${r.standing.verdict})`
      : 'no hits',
    mixture ? `mixture R² ${mixture.r2}, ${mixture.unexplained.length} unexplained bands` : '',
    bands.length > 0 ? `${bands.length} bands identified` : '',
  ]
    .filter((s) => s !== '')
    .join(' · ');
  return {
    slug,
    path: `reports/${slug}/`,
    file: site.file,
    title: `Match report: ${q.title ?? baseName(q.file)}`,
    revisions,
    summary,
    rows,
    state,
    hits,
    mixture,
    bands,
    caution: r.caution,
    plotJson,
    json: { file: `${slug}.json`, size: byteSize(options.jsonBytes ?? 0) },
  };
}
