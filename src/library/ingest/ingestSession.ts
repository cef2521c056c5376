// The state one ingest carries from file to file: which job owns which entry id, the near-duplicate pool as it
// grows, and the outcome and notes gathered so far.
import { BandshelfError } from '../../error.js';
import type { Library } from '../types.js';
import { type BuildRevisionInputsOptions, buildRevisionInputs } from './buildRevisionInputs.js';
import type { CommitOutcome, PreparedRevision } from './ingestTypes.js';
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
}

export interface IngestSession {
  prepare(job: IngestJob): PreparedRevision[];
  record(prepared: readonly PreparedRevision[], outcomes: readonly CommitOutcome[]): void;
  outcome: IngestOutcome;
}

export function ingestSession(library: Library, options: IngestSessionOptions): IngestSession {
  const { pool, index } = nearDuplicatePoolOf(library);
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
      prepareRevision(library, input, {
        force: options.force ?? false,
        pool,
        ...(options.nearDuplicateThreshold === undefined
          ? {}
          : { nearDuplicateThreshold: options.nearDuplicateThreshold }),
      }),
    );
    for (const p of prepared) owners.set(p.id, job.label);
    return prepared;
  };

  const record = (prepared: readonly PreparedRevision[], outcomes: readonly CommitOutcome[]) => {
    outcomes.forEach((o, i) => {
      (o.status === 'added' ? outcome.added : outcome.unchanged).push(o);
      for (const flag of o.qc)
        outcome.notes.push(`${o.label}: ${o.id}: ${flag.level} ${flag.code}: ${flag.message}`);
      const p = prepared[i]!;
      if (o.status !== 'added') return;
      // What the reader bent to read the file (no unit in a header …) is said now, not only by show.
      for (const w of p.extras.warnings ?? [])
        outcome.notes.push(
          `${o.label}${w.line === undefined ? '' : `:${w.line}`}: ${o.id}: warning: ${w.message}`,
        );
      const at = index.get(o.id);
      if (at === undefined) {
        index.set(o.id, pool.ids.length);
        pool.ids.push(o.id);
        pool.rows.push(p.processed);
      } else pool.rows[at] = p.processed;
    });
  };
  return { prepare, record, outcome };
}
