// The ingest pipeline behind `bandshelf add`: plans the paths, turns each job into revisions and commits them, one
// transaction per file (retrying files whose recipe waits on an entry of the same ingest) or one for all.
import { BandshelfError, errorLine } from '../../error.js';
import type { EntryMetaPatch } from '../../schema/meta.js';
import type { Recipe } from '../../schema/recipe.js';
import { commitRevisions } from '../store/commitRevisions.js';
import { defaultAuthor } from '../store/defaultAuthor.js';
import type { Library, ReadOptions } from '../types.js';
import { type IngestOutcome, type IngestSession, ingestSession } from './ingestSession.js';
import type { NearDuplicateIndex, PreparedRevision } from './ingestTypes.js';
import type { LoadedSidecar } from './loadSidecar.js';
import { type IngestJob, planIngest } from './planIngest.js';
import { waitsForAnotherEntry } from './waitsForAnotherEntry.js';

export type { IngestOutcome } from './ingestSession.js';

export interface IngestOptions {
  /** Relative paths are read against this folder.
   * @default process.cwd() */
  cwd?: string;
  /** A manifest CSV for the files; its `file` column is relative to the manifest's folder.
   * @default undefined (a folder's own `manifest.csv` is used when present) */
  manifest?: string;
  /** The paths are repeated sample traces of one time-domain entry.
   * @default false */
  timeDomain?: boolean;
  /** Reference traces for `timeDomain`.
   * @default [] */
  references?: string[];
  /** Metadata for every entry (id, name, class …), above any sidecar, manifest or file label.
   * @default {} */
  meta?: EntryMetaPatch;
  /** A metadata file (sidecar format) applied to every file, above each file's own sidecar.
   * @default undefined */
  metaFile?: { sections: LoadedSidecar; label: string };
  /** Processing recipe instead of the sidecar's or the library default.
   * @default undefined */
  recipe?: Recipe;
  /** How to read the files (units, block), above what sidecars say.
   * @default {} */
  read?: ReadOptions;
  /** Store entries even when QC raises an error-level flag.
   * @default false */
  force?: boolean;
  /** All files in one transaction: any failure stores nothing.
   * @default false */
  atomic?: boolean;
  /** Correlation above which an entry is reported as a near-duplicate of another.
   * @default 0.999 */
  nearDuplicateThreshold?: number;
  /**
   * Makes the index that shortlists library entries for the near-duplicate check: `bandshelf add` passes the
   * match layer's `libraryNearDuplicateIndex` (its kernels and search cache, which the add then extends).
   * @default undefined: every current processed vector is held in memory and scored in plain JS
   */
  nearDuplicateIndex?: (library: Library) => NearDuplicateIndex;
  /** Who makes the revisions.
   * @default defaultAuthor() */
  author?: string;
  /** Why (stored with each revision).
   * @default '' */
  message?: string;
  /** Largest data, trace, sidecar or manifest file read, bytes.
   * @default MAX_INPUT_BYTES (200 MB) */
  maxFileBytes?: number;
  /** Called after each job with the count done, the total and the job's label.
   * @default undefined */
  progress?: (done: number, total: number, label: string) => void;
}

/** Whether a recipe's reference, EMSC or subtraction step names the entry. */
function names(recipe: Recipe, id: string): boolean {
  return (
    recipe.reference?.id === id ||
    recipe.emsc?.id === id ||
    (recipe.subtract?.references.some((r) => r.id === id) ?? false)
  );
}

/** Files processed before their near-duplicate check, which scores a block's vectors in one pass. */
const BLOCK = 32;

function commitAtomic(library: Library, session: IngestSession, jobs: IngestJob[], options: IngestOptions) {
  const { failed } = session.outcome;
  const all: PreparedRevision[][] = [];
  let done = 0;
  for (const job of jobs) {
    try {
      all.push(session.prepare(job));
    } catch (error) {
      failed.push({ file: job.label, error: errorLine(error) });
    }
    options.progress?.(++done, jobs.length, job.label);
  }
  if (failed.length > 0) return;
  // Nothing is recorded before the one commit, so files are checked against the library only.
  const flagged: PreparedRevision[] = [];
  for (let b = 0; b < all.length; b += BLOCK)
    flagged.push(...session.flag(all.slice(b, b + BLOCK), { withinBlock: false }).flat());
  try {
    session.record(flagged, commitRevisions(library, flagged, commitOptions(options)));
  } catch (error) {
    failed.push({ file: flagged[0]?.label ?? jobs[0]?.label ?? '', error: errorLine(error) });
  }
}

/**
 * Jobs in order, a block at a time: prepare, check the block for near-duplicates, commit each file. A file whose
 * recipe waits on an entry ends the block before it, so it is prepared after the earlier files are committed.
 */
function commitEach(library: Library, session: IngestSession, jobs: IngestJob[], options: IngestOptions) {
  const { failed } = session.outcome;
  let done = 0;
  let pending = jobs;
  for (;;) {
    const waiting: { job: IngestJob; error: unknown }[] = [];
    let next = 0;
    while (next < pending.length) {
      const block: { job: IngestJob; prepared: PreparedRevision[] }[] = [];
      while (next < pending.length && block.length < BLOCK) {
        const job = pending[next]!;
        try {
          const prepared = session.prepare(job);
          // Its recipe pinned an entry this block is about to replace: prepare it again after the commits.
          if (block.some((b) => b.prepared.some((q) => prepared.some((p) => names(p.recipe, q.id))))) break;
          block.push({ job, prepared });
        } catch (error) {
          if (waitsForAnotherEntry(error)) {
            if (block.length > 0) break;
            waiting.push({ job, error });
          } else {
            failed.push({ file: job.label, error: errorLine(error) });
            options.progress?.(++done, jobs.length, job.label);
          }
        }
        next++;
      }
      const flagged = session.flag(
        block.map((b) => b.prepared),
        { withinBlock: true },
      );
      block.forEach(({ job }, i) => {
        const prepared = flagged[i]!;
        try {
          session.record(prepared, commitRevisions(library, prepared, commitOptions(options)));
        } catch (error) {
          failed.push({ file: job.label, error: errorLine(error) });
        }
        options.progress?.(++done, jobs.length, job.label);
      });
    }
    // Retry files whose recipe names an entry while another pass still adds entries.
    if (waiting.length === 0 || waiting.length === pending.length) {
      for (const w of waiting) {
        failed.push({ file: w.job.label, error: errorLine(w.error) });
        options.progress?.(++done, jobs.length, w.job.label);
      }
      return;
    }
    pending = waiting.map((w) => w.job);
  }
}

function commitOptions(options: IngestOptions) {
  return { author: options.author ?? defaultAuthor(), message: options.message ?? '' };
}

export function ingest(
  library: Library,
  paths: readonly string[],
  options: IngestOptions = {},
): IngestOutcome {
  const plan = planIngest(paths, {
    ...(options.cwd === undefined ? {} : { cwd: options.cwd }),
    ...(options.manifest === undefined ? {} : { manifest: options.manifest }),
    timeDomain: options.timeDomain ?? false,
    references: options.references ?? [],
  });
  if (options.meta?.id !== undefined && plan.jobs.length > 1) {
    throw new BandshelfError(
      'BAD_OPTION',
      `\`meta.id\` names one entry but ${plan.jobs.length} files are being added`,
      { field: 'id' },
    );
  }
  const session = ingestSession(library, {
    inputs: {
      ...(options.meta === undefined ? {} : { flags: options.meta }),
      ...(options.metaFile === undefined ? {} : { metaFile: options.metaFile }),
      ...(options.recipe === undefined ? {} : { recipe: options.recipe }),
      ...(options.read === undefined ? {} : { read: options.read }),
      ...(options.maxFileBytes === undefined ? {} : { maxBytes: options.maxFileBytes }),
    },
    force: options.force ?? false,
    ...(options.nearDuplicateThreshold === undefined
      ? {}
      : { nearDuplicateThreshold: options.nearDuplicateThreshold }),
    ...(options.nearDuplicateIndex === undefined ? {} : { index: options.nearDuplicateIndex(library) }),
  });
  session.outcome.notes.push(...plan.warnings);
  if (options.atomic) commitAtomic(library, session, plan.jobs, options);
  else commitEach(library, session, plan.jobs, options);
  session.close();
  return session.outcome;
}
