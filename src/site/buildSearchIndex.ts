// Builds the site's full-text index with lunr at build time, so the browser only loads and queries it.
import lunr from 'lunr';
import { assignmentsAt } from './assignmentsAt.js';
import type { SiteAssignment, SiteEntrySummary } from './types.js';

export interface SearchIndexEntry {
  summary: SiteEntrySummary;
  /** Site path of the entry page without the prefix. */
  path: string;
  /** Stored peak positions, cm⁻¹. */
  peakPositions: ArrayLike<number>;
}

export interface BuildSearchIndexOptions {
  /** Rows used to add the names of the bands at an entry's peaks (so `amide` finds proteins).
   * @default [] */
  assignments?: readonly SiteAssignment[];
  /** Tolerance for naming a peak from the table, cm⁻¹.
   * @default 4 */
  assignmentTolerance?: number;
}

/** What the browser loads: the serialised index and, per entry, what a result line shows. */
export interface SearchIndexFile {
  format: 'bandshelf-search-index';
  version: 1;
  /** ref → [name, class, path]. */
  docs: Record<string, [string, string, string]>;
  index: object;
}

/**
 * Fields: name, synonyms, id, class, tags, technique, sample form, formula, InChIKey, CAS, notes, peak positions
 * and the band names at those peaks. A peak at 1651.6 cm⁻¹ is indexed as the tokens `1651` and `1652`, so typing
 * a whole wavenumber finds bands within 1 cm⁻¹ of it. CAS numbers, InChIKeys, formulas and ids are indexed as
 * whole tokens (lunr would otherwise split them at hyphens), so `7732-18-5` matches as typed.
 */
export function buildSearchIndex(
  entries: readonly SearchIndexEntry[],
  options: BuildSearchIndexOptions = {},
): string {
  const assignments = options.assignments ?? [];
  const tolerance = options.assignmentTolerance ?? 4;
  const docs: SearchIndexFile['docs'] = {};
  const index = lunr(function build() {
    this.ref('ref');
    this.field('name', { boost: 10 });
    this.field('synonyms', { boost: 6 });
    this.field('ids', { boost: 6 });
    this.field('codes', { boost: 8 });
    this.field('class', { boost: 3 });
    this.field('tags', { boost: 3 });
    this.field('technique');
    this.field('sampleForm');
    this.field('notes');
    this.field('peaks', { boost: 2 });
    this.field('bands');
    // Positions and whole-token codes must not lose characters to the stemmer; lunr keeps array items whole.
    for (const entry of entries) {
      const s = entry.summary;
      const peakTokens = new Set<string>();
      const bandNames = new Set<string>();
      for (let i = 0; i < entry.peakPositions.length; i++) {
        const p = entry.peakPositions[i]!;
        if (!Number.isFinite(p)) continue;
        peakTokens.add(String(Math.floor(p)));
        peakTokens.add(String(Math.ceil(p)));
        for (const a of assignmentsAt(p, assignments, { tolerance })) bandNames.add(a.label);
      }
      const codes = [s.cas, s.inchiKey, s.formula].filter((c) => c !== '');
      this.add({
        ref: s.id,
        name: s.name,
        synonyms: s.synonyms.join(' '),
        ids: [s.id, ...s.id.split(/[-_.]+/).filter((part) => part !== '')],
        codes,
        class: s.class,
        tags: s.tags.join(' '),
        technique: s.technique,
        sampleForm: s.sampleForm,
        notes: s.notes,
        peaks: [...peakTokens],
        bands: [...bandNames].join(' '),
      });
      docs[s.id] = [s.name, s.class, entry.path];
    }
  });
  const file: SearchIndexFile = { format: 'bandshelf-search-index', version: 1, docs, index: index.toJSON() };
  return `${JSON.stringify(file)}\n`;
}
