// Gathers what a site build shows from an open library: entries, releases with their diffs, the band-assignment
// table and the processed vectors of one state. Entry vectors are read later, one entry at a time.
import { BandshelfError } from '../error.js';
import { diffStates } from '../library/store/diffStates.js';
import { entryHistory } from '../library/store/entryHistory.js';
import { listAssignments } from '../library/store/listAssignments.js';
import { listEntries } from '../library/store/listEntries.js';
import { listReleases } from '../library/store/listReleases.js';
import { readEntry } from '../library/store/readEntry.js';
import { readRelease } from '../library/store/readRelease.js';
import { readSearchSet } from '../library/store/readSearchSet.js';
import type { EntrySummary, Library } from '../library/types.js';
import { cachedWrongHitNull } from '../match/cachedWrongHitNull.js';
import { searchLibrary } from '../match/searchLibrary.js';
import { shippedAssignments } from '../match/shippedAssignments.js';
import type { WrongHitNull } from '../match/wrongHitNull.js';
import type { Spectrum } from '../spectrum/types.js';
import type { SiteAssignment, SiteEntrySummary, SiteRelease, SiteSource } from './types.js';

export interface CollectSiteDataOptions {
  /** A release tag, or undefined / 'current' for the working state.
   * @default undefined */
  at?: string | null;
  /** Show the band-assignment rows the lab added to its library after the shipped table.
   * @default true */
  labAssignments?: boolean;
}

function text(meta: Record<string, unknown>, key: string): string {
  const v = meta[key];
  return typeof v === 'string' ? v : typeof v === 'number' ? String(v) : '';
}

function list(meta: Record<string, unknown>, key: string): string[] {
  const v = meta[key];
  return Array.isArray(v) ? v.filter((t): t is string => typeof t === 'string') : [];
}

function summaryOf(e: EntrySummary): SiteEntrySummary {
  const meta = e.meta;
  return {
    id: e.id,
    revision: e.revision,
    name: e.name,
    class: e.class,
    technique: text(meta, 'technique'),
    sampleForm: text(meta, 'sampleForm'),
    tags: list(meta, 'tags'),
    synonyms: list(meta, 'synonyms'),
    formula: text(meta, 'formula'),
    inchiKey: text(meta, 'inchiKey'),
    cas: text(meta, 'cas'),
    notes: text(meta, 'notes'),
    date: text(meta, 'date') || e.createdAt.slice(0, 10),
    createdAt: e.createdAt,
    reviewState: e.reviewState,
    coverage: e.coverage,
    synthetic: meta.synthetic === true,
    meta,
  };
}

const publishedNull = (n: WrongHitNull) => ({
  scores: Array.from(n.scores),
  entries: n.entries,
  sampled: n.sampled,
});

export function collectSiteData(library: Library, options: CollectSiteDataOptions = {}): SiteSource {
  const at = options.at === undefined || options.at === null || options.at === 'current' ? null : options.at;
  // readSearchSet first: it refuses an unknown release tag before anything else is read.
  const set = readSearchSet(library, { at });
  const entries = listEntries(library, { at }).map(summaryOf);
  const summaries = new Map(entries.map((e) => [e.id, e]));

  const releases: SiteRelease[] = [];
  let previous: string | null = null;
  for (const r of listReleases(library)) {
    let diff: SiteRelease['diff'];
    if (previous === null) {
      diff = {
        added: readRelease(library, r.tag).members.map((m) => ({ id: m.id })),
        changed: [],
        removed: [],
      };
    } else {
      const d = diffStates(library, previous, r.tag);
      diff = {
        added: d.added.map((a) => ({ id: a.id })),
        changed: d.changed.map((c) => ({ id: c.id, what: [...c.what] })),
        removed: d.removed.map((a) => ({ id: a.id })),
      };
    }
    releases.push({ ...r, previous, diff });
    previous = r.tag;
  }

  const assignments: SiteAssignment[] = [
    ...shippedAssignments().map((a) => ({ ...a, class: [...a.class], origin: a.origin ?? 'shipped' })),
    ...(options.labAssignments === false
      ? []
      : listAssignments(library).map((a) => ({ ...a, class: [...a.class], origin: a.origin ?? 'lab' }))),
  ];

  // The in-browser matcher processes an unknown with the library recipe, which may need library spectra.
  const references: Record<string, Spectrum> = {};
  for (const step of [set.recipe.reference, set.recipe.emsc]) {
    if (step && !(step.id in references)) {
      const view = readEntry(
        library,
        step.id,
        step.revision === undefined ? {} : { revision: step.revision },
      );
      references[step.id] = view.original;
    }
  }

  return {
    name: library.name,
    at,
    stateKey: set.stateKey,
    grid: set.grid,
    recipe: set.recipe,
    entries,
    releases,
    assignments,
    matrix: {
      processed: set.processed,
      rows: set.rows,
      cols: set.cols,
      ids: set.entries.map((e) => e.id),
      revisions: set.entries.map((e) => e.revision),
      hashes: set.entries.map((e) => e.hash),
      peaks: set.peaks,
      assignments: [...shippedAssignments(), ...listAssignments(library)],
      wrongHitNull: publishedNull(
        cachedWrongHitNull(
          { libraryPath: library.path, set },
          { search: (queries, k) => searchLibrary(library, queries, { set, k, metric: 'pearson' }) },
        ),
      ),
    },
    references,
    loadEntry(id) {
      const summary = summaries.get(id);
      if (summary === undefined) {
        throw new BandshelfError('NOT_FOUND', `entry '${id}' is not in the state the site shows`, {
          field: 'id',
        });
      }
      const view = readEntry(library, id, { at });
      return {
        summary,
        hash: view.hash,
        original: view.original,
        grid: view.grid,
        processed: view.processed,
        recipe: view.recipe,
        peaks: view.peaks,
        qc: view.qc,
        extras: { ...view.extras },
        files: view.files.map((f) => ({ ...f })),
        history: entryHistory(library, id).map((h) => ({
          revision: h.revision,
          kind: h.kind,
          hash: h.hash,
          author: h.author,
          message: h.message,
          createdAt: h.createdAt,
          reviewState: h.reviewState,
          changed: [...h.changed],
          releases: [...h.releases],
        })),
      };
    },
  };
}
