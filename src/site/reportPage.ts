// Builds the page model of one match report: the unknown, the library state, hits, mixture, bands and plot data.
import { formatNumber } from './formatNumber.js';
import { jsonForScript } from './jsonForScript.js';
import type { ReportPage, SiteReport, SiteRow } from './types.js';

export interface ReportPageOptions {
  /** Entry id → site path segment, to link hits to entry pages.
   * @default empty (no links) */
  slugs?: Map<string, string>;
  /** The report's URL segment.
   * @default report.slug */
  slug?: string;
  /** Shown when the report carries no caution of its own.
   * @default '' */
  caution?: string;
  /** Entry id → processed vector on the grid, to overlay hits on the unknown.
   * @default none (no overlay of hits) */
  vectors?: (id: string) => ArrayLike<number> | undefined;
  /** The grid axis (ascending), for the plots.
   * @default undefined (no plots) */
  axis?: Float64Array;
  /** How many hits the overlay draws.
   * @default 3 */
  overlayHits?: number;
}

type Json = Record<string, unknown>;

const obj = (v: unknown): Json => (v !== null && typeof v === 'object' && !Array.isArray(v) ? (v as Json) : {});
const arr = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);
const str = (v: unknown): string => (typeof v === 'string' ? v : typeof v === 'number' ? String(v) : '');
const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

export function reportPage(report: SiteReport, options: ReportPageOptions = {}): ReportPage {
  const r = report.report;
  const slugs = options.slugs ?? new Map<string, string>();
  const pathOf = (id: string): string | null => {
    const s = slugs.get(id);
    return s === undefined ? null : `entries/${s}/`;
  };
  const slug = options.slug ?? report.slug;
  const query = obj(r.query);
  const library = obj(r.library);
  const file = str(query.file) || report.file;

  const rows: SiteRow[] = [];
  if (file) rows.push({ label: 'File', value: file });
  if (str(query.hash)) rows.push({ label: 'SHA-256', value: str(query.hash) });
  const overlap = num(query.overlap) ?? num(obj(query.coverage).overlap);
  if (overlap !== undefined) rows.push({ label: 'Overlap used', value: `${formatNumber(overlap, { decimals: 0 })} cm⁻¹` });
  if (str(r.createdAt)) rows.push({ label: 'Report made', value: str(r.createdAt) });
  if (num(r.version) !== undefined) rows.push({ label: 'Report format', value: `version ${str(r.version)}` });

  const state: SiteRow[] = [];
  const release = str(library.release) || str(library.at);
  state.push({ label: 'Release', value: release || 'working state (not a release)' });
  if (str(library.stateKey)) state.push({ label: 'State key', value: str(library.stateKey) });
  if (str(library.name)) state.push({ label: 'Library', value: str(library.name) });
  const revisions = arr(library.revisions);
  if (revisions.length > 0) state.push({ label: 'Revisions', value: `${revisions.length} entries` });
  const entriesCount = num(library.entries);
  if (entriesCount !== undefined) state.push({ label: 'Entries', value: String(entriesCount) });

  // Hits come per metric, as a map metric → list or as a list carrying its metric.
  const hitGroups: ReportPage['hits'] = [];
  const hitsValue = r.hits;
  const groups: [string, unknown[]][] = Array.isArray(hitsValue)
    ? [[str(r.metric) || 'pearson', hitsValue]]
    : Object.entries(obj(hitsValue)).map(([metric, list]) => [metric, arr(list)]);
  for (const [metric, list] of groups) {
    hitGroups.push({
      metric,
      rows: list.map((h, i) => {
        const hit = obj(h);
        const id = str(hit.id);
        const extras: string[] = [];
        const z = num(hit.z) ?? num(hit.zScore);
        if (z !== undefined) extras.push(`z = ${formatNumber(z, { significant: 3 })}`);
        const gap = num(hit.gap);
        if (gap !== undefined) extras.push(`gap to next ${formatNumber(gap, { significant: 3 })}`);
        const ov = num(hit.overlap);
        if (ov !== undefined) extras.push(`overlap ${formatNumber(ov, { decimals: 0 })} cm⁻¹`);
        return {
          rank: num(hit.rank) ?? i + 1,
          id,
          path: pathOf(id),
          name: str(hit.name),
          score: formatNumber(num(hit.score), { decimals: 4 }),
          extra: extras.join(', '),
        };
      }),
    });
  }

  let mixture: ReportPage['mixture'] = null;
  const m = obj(r.mixture);
  if (Object.keys(m).length > 0) {
    mixture = {
      r2: formatNumber(num(m.r2), { decimals: 4 }),
      components: arr(m.components).map((c) => {
        const comp = obj(c);
        const id = str(comp.id);
        const share = num(comp.share);
        return {
          id,
          path: pathOf(id),
          name: str(comp.name),
          weight: formatNumber(num(comp.weight)),
          share: share === undefined ? '–' : `${formatNumber(share * 100, { decimals: 1 })} %`,
        };
      }),
      unexplained: arr(m.residualBands).map((b) => {
        const band = obj(b);
        return { position: formatNumber(num(band.position), { decimals: 1 }), height: formatNumber(num(band.height)) };
      }),
    };
  }

  const bands: ReportPage['bands'] = arr(r.bands).map((b) => {
    const band = obj(b);
    const explained = band.explained;
    return {
      position: formatNumber(num(band.position), { decimals: 1 }),
      height: formatNumber(num(band.height)),
      width: formatNumber(num(band.fwhm) ?? num(band.width), { decimals: 1 }),
      kind: str(band.kind) || (band.shoulder === true ? 'shoulder' : 'peak'),
      assignments: arr(band.assignments).map((a) => {
        const as = obj(a);
        return { label: str(as.label), class: arr(as.class).map(str).join(', ') || str(as.class), source: str(as.source) };
      }),
      candidates: arr(band.candidates).map((c) => {
        const id = str(obj(c).id);
        return { id, path: pathOf(id) };
      }),
      explained: explained === true ? 'yes' : explained === false ? 'no' : '–',
    };
  });

  const plotJson = options.axis ? plotDataJson(r, options) : '';
  const top = hitGroups[0]?.rows[0];
  const summary = [
    top ? `top hit ${top.id} (${top.score})` : 'no hits',
    mixture ? `mixture R² ${mixture.r2}, ${mixture.unexplained.length} unexplained bands` : '',
    bands.length > 0 ? `${bands.length} bands identified` : '',
  ]
    .filter((s) => s !== '')
    .join(' · ');
  return {
    slug,
    path: `reports/${slug}/`,
    file: report.file,
    title: `Match report: ${file || slug}`,
    summary,
    rows,
    state,
    hits: hitGroups,
    mixture,
    bands,
    caution: str(r.caution) || options.caution || '',
    plotJson,
  };
}

function plotDataJson(r: Json, options: ReportPageOptions): string {
  const axis = options.axis!;
  const query = obj(r.query);
  const unknown = arr(query.processed);
  if (unknown.length !== axis.length) return '';
  const series: { name: string; role: string; y: (number | null)[] }[] = [];
  const clean = (values: ArrayLike<unknown>): (number | null)[] => {
    const out = new Array<number | null>(values.length);
    for (let i = 0; i < values.length; i++) {
      const v = values[i];
      out[i] = typeof v === 'number' && Number.isFinite(v) ? Number(v.toPrecision(5)) : null;
    }
    return out;
  };
  series.push({ name: `unknown (${str(query.file) || 'query'})`, role: 'unknown', y: clean(unknown) });
  const hitsValue = r.hits;
  const firstList = Array.isArray(hitsValue) ? hitsValue : arr(Object.values(obj(hitsValue))[0]);
  for (const h of firstList.slice(0, options.overlayHits ?? 3)) {
    const id = str(obj(h).id);
    const v = options.vectors?.(id);
    if (v && v.length === axis.length) series.push({ name: id, role: 'hit', y: clean(v as ArrayLike<unknown>) });
  }
  const m = obj(r.mixture);
  const fitted = arr(m.fitted);
  const residual = arr(m.residual);
  const mixtureSeries: { name: string; role: string; y: (number | null)[] }[] = [];
  if (fitted.length === axis.length) mixtureSeries.push({ name: 'mixture fit', role: 'fit', y: clean(fitted) });
  if (residual.length === axis.length) mixtureSeries.push({ name: 'residual', role: 'residual', y: clean(residual) });
  const marks = arr(m.residualBands)
    .map((b) => num(obj(b).position))
    .filter((p): p is number => p !== undefined);
  return jsonForScript({
    x: Array.from(axis),
    overlay: series,
    mixture: mixtureSeries.length > 0 ? [series[0]!, ...mixtureSeries] : [],
    unexplained: marks,
  });
}
