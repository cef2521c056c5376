// Builds the page model of one entry: display strings for its facts, tables, history and downloads.
import { assignmentsAt } from './assignmentsAt.js';
import { byteSize } from './byteSize.js';
import { formatNumber } from './formatNumber.js';
import { metaRows } from './metaRows.js';
import { recipeRows } from './recipeRows.js';
import { releaseAnchor } from './releaseAnchor.js';
import { techniqueLabel } from './techniqueLabel.js';
import type { EntryPage, SiteAssignment, SiteEntryDetail, SiteRow } from './types.js';

export interface EntryPageOptions {
  /** Band-assignment rows used to name the peaks.
   * @default [] */
  assignments?: readonly SiteAssignment[];
  /** Tolerance for naming a peak from the table, cm⁻¹.
   * @default 4 */
  assignmentTolerance?: number;
  /** Size of the JSON download already written, bytes.
   * @default 0 */
  dataBytes?: number;
  /** Size of the processed-vector file already written, bytes.
   * @default 0 */
  processedBytes?: number;
  /** The site path segment of the entry's folder.
   * @default the entry id */
  slug?: string;
}

function extraRows(extras: Record<string, unknown>): SiteRow[] {
  const rows: SiteRow[] = [];
  const num = (v: unknown): number | undefined =>
    typeof v === 'number' && Number.isFinite(v) ? v : undefined;
  const scale = num(extras.referenceScale);
  if (scale !== undefined) rows.push({ label: 'Reference scale', value: formatNumber(scale) });
  const range = num(extras.dynamicRangeOrders);
  if (range !== undefined) {
    rows.push({ label: 'Reference dynamic range', value: `${formatNumber(range, { decimals: 1 })} orders` });
  }
  const spread = num(extras.timingSpreadAs);
  if (spread !== undefined)
    rows.push({ label: 'Timing spread', value: `${formatNumber(spread, { significant: 3 })} as` });
  const traces = extras.traces as { sample?: unknown; reference?: unknown } | undefined;
  if (traces && typeof traces === 'object') {
    rows.push({
      label: 'Traces averaged',
      value: `${String(traces.sample)} sample, ${String(traces.reference)} reference`,
    });
  }
  const source = extras.source as { format?: unknown; xUnit?: unknown; yUnit?: unknown } | undefined;
  if (source && typeof source === 'object') {
    rows.push({
      label: 'Source file',
      value: `${String(source.format ?? '')}, x in ${String(source.xUnit ?? '')}, y in ${String(source.yUnit ?? '')}`,
    });
  }
  const warnings = extras.warnings;
  if (Array.isArray(warnings) && warnings.length > 0) {
    rows.push({
      label: 'Reader warnings',
      value: warnings
        .map((w: { line?: number; message?: string }) =>
          w.line === undefined ? String(w.message) : `line ${w.line}: ${String(w.message)}`,
        )
        .join('; '),
    });
  }
  return rows;
}

export function entryPage(detail: SiteEntryDetail, options: EntryPageOptions = {}): EntryPage {
  const s = detail.summary;
  const assignments = options.assignments ?? [];
  const tolerance = options.assignmentTolerance ?? 4;
  const slug = options.slug ?? s.id;
  const x = detail.original.wavenumber;
  const coverage =
    x.length > 0
      ? `${formatNumber(x[x.length - 1]!, { decimals: 0 })}–${formatNumber(x[0]!, { decimals: 0 })} cm⁻¹, ${x.length} points`
      : 'no data';
  const releasesOf = new Map<string, number>();
  for (const h of detail.history) for (const tag of h.releases) releasesOf.set(tag, h.revision);
  return {
    id: s.id,
    slug,
    path: `entries/${slug}/`,
    name: s.name,
    class: s.class,
    technique: techniqueLabel(s.technique),
    revision: s.revision,
    reviewState: s.reviewState,
    createdAt: s.createdAt.slice(0, 10),
    synthetic: s.synthetic,
    coverage,
    metaRows: metaRows(s.meta, { omit: ['name'] }),
    extraRows: extraRows(detail.extras),
    peaks: [...detail.peaks]
      .sort((a, b) => b.position - a.position)
      .map((p) => ({
        position: formatNumber(p.position, { decimals: 1 }),
        height: formatNumber(p.height),
        prominence: formatNumber(p.prominence),
        fwhm: formatNumber(p.fwhm, { decimals: 1 }),
        assignments: assignmentsAt(p.position, assignments, { tolerance })
          .map((a) => a.label)
          .join('; '),
      })),
    qc: detail.qc.map((q) => ({
      level: q.level,
      code: q.code,
      message: q.message,
      value: q.value === undefined ? '' : formatNumber(q.value),
    })),
    history: [...detail.history]
      .sort((a, b) => b.revision - a.revision)
      .map((h) => ({
        revision: h.revision,
        kind: h.kind,
        date: h.createdAt.slice(0, 10),
        author: h.author,
        message: h.message,
        changed: h.changed.length > 0 ? h.changed.join(', ') : h.revision === 1 ? 'first revision' : '–',
        reviewState: h.reviewState,
        releases: h.releases.join(', '),
        shown: h.revision === s.revision,
      })),
    releases: [...releasesOf.entries()]
      .map(([tag, revision]) => ({ tag, revision, anchor: releaseAnchor(tag) }))
      .sort((a, b) => a.revision - b.revision || a.tag.localeCompare(b.tag, 'en')),
    dataFile: { file: `${slug}.json`, bytes: options.dataBytes ?? 0, size: byteSize(options.dataBytes ?? 0) },
    processedFile: {
      file: `${slug}.processed.f32`,
      bytes: options.processedBytes ?? 0,
      size: byteSize(options.processedBytes ?? 0),
    },
    derived: [
      { format: 'csv', label: 'CSV', file: `${slug}.csv` },
      { format: 'jcamp-dx', label: 'JCAMP-DX', file: `${slug}.jdx` },
    ],
    recipe: recipeRows(detail.recipe),
  };
}
