// The state one ingest carries from file to file: which job owns which entry id, the near-duplicate pool as it
// grows, and the outcome and notes gathered so far.
import { BandshelfError } from '../../error.js';
import { gridAxis } from '../../spectrum/gridAxis.js';
import { readProcessedVector } from '../store/readProcessedVector.js';
import type { Library } from '../types.js';
import { type BuildRevisionInputsOptions, buildRevisionInputs } from './buildRevisionInputs.js';
import type { CommitOutcome, NearDuplicateIndex, PreparedRevision } from './ingestTypes.js';
import { type NearDuplicatePool, nearDuplicateFlag } from './nearDuplicateFlag.js';
import { nearDuplicatePoolOf } from './nearDuplicatePoolOf.js';
import type { IngestJob } from './planIngest.js';
import { prepareRevision } from './prepareRevision.js';

/** What an ingest did: the `{added, unchanged, failed}` that `add --json` prints, plus notes for the user. */
export interface IngestOutcome {
  added: CommitOutcome[];
  unchanged: CommitOutcome[];
  failed: { file: string; error: string }[];
  /** Warnings to show (planning notes, QC warnings, what a reader bent to read a file), one line each. */
  notes: string[];
}

export interface IngestSessionOptions {
  /** How each job's files become revision inputs (metadata, recipe, reading options). */
  inputs: BuildRevisionInputsOptions;
  /** Store entries even when QC raises an error-level flag.
   * @default false */
  force?: boolean;
  /** Correlation above which two entries are reported as near-duplicates.
   * @default 0.999 */
  nearDuplicateThreshold?: number;
  /** Shortlists library entries for the near-duplicate check (kernels and search cache).
   * @default undefined: every current vector is held in memory and scored in plain JS */
  index?: NearDuplicateIndex;
}

export interface IngestSession {
  /** A job's revisions, processed and QC-checked, without the near-duplicate check (see `flag`). */
  prepare(job: IngestJob): PreparedRevision[];
  /**
   * A block of jobs' revisions with their near-duplicate flags: each against the library, the revisions this
   * ingest recorded so far and, with `withinBlock`, the block's earlier revisions (they are committed first).
   */
  flag(block: readonly PreparedRevision[][], options: { withinBlock: boolean }): PreparedRevision[][];
  record(prepared: readonly PreparedRevision[], outcomes: readonly CommitOutcome[]): void;
  /** After the last commit: the index writes the next state's search cache. */
  close(): void;
  outcome: IngestOutcome;
}

/** Library entries whose kernel score is below this much under the threshold are not scored exactly. */
const SHORTLIST_MARGIN = 0.01;

export function ingestSession(library: Library, options: IngestSessionOptions): IngestSession {
  const index = options.index ?? null;
  // Without an index the pool starts as the whole library; with one it holds only this ingest's own revisions.
  const own = (): { pool: NearDuplicatePool; index: Map<string, number> } => ({
    pool: { ids: [], rows: [] },
    index: new Map(),
  });
  const { pool, index: rowOf } = index === null ? nearDuplicatePoolOf(library) : own();
  const threshold = options.nearDuplicateThreshold ?? 0.999;
  const axis = gridAxis(library.grid);
  const owners = new Map<string, string>();
  const outcome: IngestOutcome = { added: [], unchanged: [], failed: [], notes: [] };

  const prepare = (job: IngestJob): PreparedRevision[] => {
    const inputs = buildRevisionInputs(library, job, options.inputs);
    for (const input of inputs) {
      const owner = owners.get(input.meta.id);
      if (owner !== undefined && owner !== job.label) {
        throw new BandshelfError(
          'ALREADY_EXISTS',
          `entry id '${input.meta.id}' is also given to ${owner} in this add`,
          { file: job.label, field: 'id' },
        );
      }
    }
    const prepared = inputs.map((input) =>
      prepareRevision(library, input, { force: options.force ?? false }),
    );
    for (const p of prepared) owners.set(p.id, job.label);
    return prepared;
  };

  const flag = (block: readonly PreparedRevision[][], how: { withinBlock: boolean }) => {
    const all = block.flat();
    const shortlists =
      index === null || all.length === 0
        ? null
        : index.shortlist(
            all.map((p) => p.processed),
            threshold - SHORTLIST_MARGIN,
          );
    const earlier: NearDuplicatePool = { ids: [], rows: [] };
    const replaced = new Set<string>();
    let k = 0;
    return block.map((revisions) =>
      revisions.map((p) => {
        // An entry this ingest already replaced is scored by its new vector only, not the library's older one.
        const listed = (shortlists?.[k++] ?? []).filter((e) => !rowOf.has(e.id) && !replaced.has(e.id));
        const kept = pool.ids.flatMap((id, i) => (replaced.has(id) ? [] : [i]));
        const candidates: NearDuplicatePool = {
          ids: [...listed.map((e) => e.id), ...kept.map((i) => pool.ids[i]!), ...earlier.ids],
          rows: [
            ...listed.map((e) => readProcessedVector(library, e)),
            ...kept.map((i) => pool.rows[i]!),
            ...earlier.rows,
          ],
        };
        if (how.withinBlock) {
          replaced.add(p.id);
          earlier.ids.push(p.id);
          earlier.rows.push(p.processed);
        }
        const duplicate = nearDuplicateFlag(p.processed, candidates, {
          exclude: p.id,
          threshold,
          wavenumber: axis,
        });
        return duplicate === null ? p : { ...p, qc: [...p.qc, duplicate] };
      }),
    );
  };

  const record = (prepared: readonly PreparedRevision[], outcomes: readonly CommitOutcome[]) => {
    const stored = [];
    for (const [i, o] of outcomes.entries()) {
      (o.status === 'added' ? outcome.added : outcome.unchanged).push(o);
      for (const flag of o.qc)
        outcome.notes.push(`${o.label}: ${o.id}: ${flag.level} ${flag.code}: ${flag.message}`);
      const p = prepared[i]!;
      if (o.status !== 'added') continue;
      // What the reader bent to read the file (no unit in a header …) is said now, not only by show.
      for (const w of p.extras.warnings ?? [])
        outcome.notes.push(
          `${o.label}${w.line === undefined ? '' : `:${w.line}`}: ${o.id}: warning: ${w.message}`,
        );
      const at = rowOf.get(o.id);
      if (at === undefined) {
        rowOf.set(o.id, pool.ids.length);
        pool.ids.push(o.id);
        pool.rows.push(p.processed);
      } else pool.rows[at] = p.processed;
      stored.push({ id: o.id, revision: o.revision, hash: o.hash, processed: p.processed });
    }
    if (stored.length > 0) index?.committed(stored);
  };
  return { prepare, flag, record, close: () => index?.close(), outcome };
}
