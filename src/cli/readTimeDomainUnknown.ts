// Reads field-resolved sample and reference traces from disk into one unknown, as `add --time-domain` makes one entry.
import { createHash } from 'node:crypto';
import { basename, resolve } from 'node:path';
import type { SourceFile } from '../library/ingest/ingestTypes.js';
import { readOriginals } from '../library/store/readOriginals.js';
import { readRegularFile } from '../library/store/readRegularFile.js';
import type { MatchUnknown } from '../match/pipeline/types.js';
import { type Recipe, timeDomainSchema } from '../schema/recipe.js';
import { pinNoiseFloor } from '../spectrum/trace/pinNoiseFloor.js';

export interface TimeDomainTraces {
  /** The sample traces of one measurement, as the user named them. */
  samples: readonly string[];
  /** Their reference traces. */
  references: readonly string[];
  /** The recipe whose time-domain step converts them (the library's, or `--recipe`). */
  recipe: Recipe;
}

export interface ReadTimeDomainUnknownOptions {
  /** The folder relative files are read against. @default process.cwd() */
  cwd?: string;
  /** Keep the first sample's path as given (else its file name only). @default false */
  keepPath?: boolean;
  /** Delay unit overriding the traces' headers. @default undefined (from the headers) */
  timeUnit?: 'fs' | 'ps';
  /** The library grid's step, cm⁻¹, for the record-length resolution warning. @default undefined */
  gridStep?: number;
  /** The measuring technique, for the unknown's ATR default (`--technique`). @default undefined */
  technique?: string;
}

/**
 * Through the same conversion `add --time-domain` uses (the recipe's time-domain step, or the step's defaults, with
 * the noise floor pinned as ingest pins it). The unknown's hash is the SHA-256 of the sample files' bytes followed by
 * the references', in the order given; it is named after the first sample.
 */
export function readTimeDomainUnknown(
  traces: TimeDomainTraces,
  options: ReadTimeDomainUnknownOptions = {},
): MatchUnknown {
  const cwd = options.cwd ?? process.cwd();
  const hash = createHash('sha256');
  const files: SourceFile[] = [
    ...traces.samples.map((f) => ({ role: 'sample-trace' as const, f })),
    ...traces.references.map((f) => ({ role: 'reference-trace' as const, f })),
  ].map(({ role, f }) => {
    const bytes = readRegularFile(resolve(cwd, f), { label: f });
    hash.update(bytes);
    return { role, name: basename(f), bytes };
  });
  const step = pinNoiseFloor(traces.recipe.timeDomain ?? timeDomainSchema.parse({}));
  const [original] = readOriginals(
    {
      files,
      read: options.timeUnit === undefined ? {} : { timeUnit: options.timeUnit },
      recipe: { ...traces.recipe, timeDomain: step },
    },
    {
      label: traces.samples[0],
      ...(options.gridStep === undefined ? {} : { gridStep: options.gridStep }),
    },
  );
  const first = traces.samples[0]!;
  return {
    file: options.keepPath === true ? first : basename(first),
    hash: hash.digest('hex'),
    spectrum: original!.spectrum,
    warnings: (original!.extras.warnings ?? []).map((w) =>
      w.line === undefined ? w.message : `line ${w.line}: ${w.message}`,
    ),
    // The record length's resolution 1/(c·T), so like with like compares it as an entry of that resolution.
    resolution: original!.labels.resolution,
    ...(options.technique === undefined ? {} : { technique: options.technique }),
  };
}
