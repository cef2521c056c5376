// Assembles the global data the templates read: counts, browse rows, releases with diffs, the assignment table.
import { BAND_TOLERANCE_CM1 } from '../match/types.js';
import type { Grid } from '../schema/recipe.js';
import { gridLength } from '../spectrum/gridLength.js';
import { formatNumber } from './formatNumber.js';
import { releaseAnchor } from './releaseAnchor.js';
import { techniqueLabel } from './techniqueLabel.js';
import type { ContrastPage, EntryPage, ReleasePage, ReportPage, SiteSource, SiteView } from './types.js';

export interface SiteViewOptions {
  /** Page models of the entries, in `source.entries` order.
   * @default [] */
  entryPages?: EntryPage[];
  /** Page models of the match reports.
   * @default [] */
  reportPages?: ReportPage[];
  /** Page models of the contrast reports.
   * @default [] */
  contrastPages?: ContrastPage[];
  /** The entry id → site path segment map (ids are slugs already; kept separate so links and pages agree).
   * @default each id maps to itself */
  slugs?: Map<string, string>;
  /** Printed in the footer.
   * @default 'bandshelf' */
  version?: string;
  /** The caution every page carries.
   * @default '' */
  caution?: string;
  /** How many of the newest revisions the home page lists.
   * @default 8 */
  newest?: number;
}

function counted(
  values: string[],
  label: (v: string) => string = (v) => v,
): { label: string; count: number }[] {
  const counts = new Map<string, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  return [...counts.entries()]
    .map(([v, count]) => ({ label: label(v), count }))
    .sort((a, b) => b.count - a.count || a.label.localeCompare(b.label, 'en'));
}

function sortedUnique(values: string[]): string[] {
  return [...new Set(values.filter((v) => v !== ''))].sort((a, b) => a.localeCompare(b, 'en'));
}

function gridText(grid: Grid): string {
  const hi = Math.max(grid.start, grid.stop);
  const lo = Math.min(grid.start, grid.stop);
  return `${formatNumber(hi)}–${formatNumber(lo)} cm⁻¹ in steps of ${formatNumber(grid.step)} cm⁻¹ (${gridLength(grid)} points)`;
}

export function siteView(source: SiteSource, options: SiteViewOptions = {}): SiteView {
  const slugs = options.slugs ?? new Map(source.entries.map((e) => [e.id, e.id]));
  const pathOf = (id: string): string | null => {
    const slug = slugs.get(id);
    return slug === undefined ? null : `entries/${slug}/`;
  };
  const entries = source.entries;
  const newestRelease = source.releases.at(-1)?.tag ?? null;
  const releases: ReleasePage[] = [...source.releases].reverse().map((r) => ({
    tag: r.tag,
    anchor: releaseAnchor(r.tag),
    date: r.createdAt.slice(0, 10),
    message: r.message,
    reviewedOnly: r.reviewedOnly,
    entries: r.entries,
    previous: r.previous,
    added: r.diff.added.map((a) => ({ id: a.id, path: pathOf(a.id) })),
    changed: r.diff.changed.map((c) => ({ id: c.id, path: pathOf(c.id), what: c.what.join(', ') })),
    removed: r.diff.removed.map((a) => ({ id: a.id, path: pathOf(a.id) })),
    shown: r.tag === source.at,
  }));
  const newestCount = options.newest ?? 8;
  const newest = [...entries]
    .sort((a, b) => (a.createdAt < b.createdAt ? 1 : a.createdAt > b.createdAt ? -1 : a.id < b.id ? -1 : 1))
    .slice(0, newestCount)
    .map((e) => ({
      id: e.id,
      path: pathOf(e.id) ?? '',
      name: e.name,
      class: e.class,
      revision: e.revision,
      date: e.createdAt.slice(0, 10),
    }));
  return {
    name: source.name,
    version: options.version ?? 'bandshelf',
    caution: options.caution ?? '',
    empty: entries.length === 0,
    state: {
      label: source.at === null ? 'working state (not a release)' : `release ${source.at}`,
      at: source.at,
      stateKey: source.stateKey,
      shortKey: source.stateKey.slice(0, 12),
      newestRelease,
    },
    grid: gridText(source.grid),
    bandTolerance: BAND_TOLERANCE_CM1,
    counts: {
      total: entries.length,
      byClass: counted(entries.map((e) => e.class)),
      byTechnique: counted(
        entries.map((e) => e.technique),
        (v) => techniqueLabel(v),
      ),
    },
    newest,
    browse: {
      rows: entries.map((e) => ({
        id: e.id,
        path: pathOf(e.id) ?? '',
        name: e.name,
        class: e.class,
        technique: e.technique,
        techniqueLabel: techniqueLabel(e.technique),
        sampleForm: e.sampleForm,
        tags: e.tags.join(', '),
        tagKey: `|${e.tags.join('|')}|`,
        date: e.date,
        revision: e.revision,
        reviewState: e.reviewState,
        coverage:
          e.coverage === null
            ? 'none'
            : `${formatNumber(e.coverage.max, { decimals: 0 })}–${formatNumber(e.coverage.min, { decimals: 0 })}`,
        coverageWidth: e.coverage === null ? 0 : e.coverage.max - e.coverage.min,
      })),
      reviewStates: sortedUnique(entries.map((e) => e.reviewState)),
      classes: sortedUnique(entries.map((e) => e.class)),
      techniques: sortedUnique(entries.map((e) => e.technique)).map((v) => ({
        value: v,
        label: techniqueLabel(v),
      })),
      tags: sortedUnique(entries.flatMap((e) => e.tags)),
      sampleForms: sortedUnique(entries.map((e) => e.sampleForm)),
    },
    entries: options.entryPages ?? [],
    reports: options.reportPages ?? [],
    contrasts: options.contrastPages ?? [],
    releases,
    assignments: source.assignments.map((a) => ({
      range:
        a.min === a.max
          ? formatNumber(a.min, { decimals: 0 })
          : `${formatNumber(a.max, { decimals: 0 })}–${formatNumber(a.min, { decimals: 0 })}`,
      label: a.label,
      vibration: a.vibration,
      group: a.group,
      class: a.class.join(', '),
      source: a.source,
      basis: a.basis,
      origin: a.origin,
    })),
  };
}
