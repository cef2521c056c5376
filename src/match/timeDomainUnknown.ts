// Turns sample and reference trace files into the match pipeline's unknown (browser-safe): `match --time-domain
// --reference` and the site's matcher both call it, so a trace pair gives the same unknown in either.
import { BandshelfError } from '../error.js';
import { readTimeDomainPair, type TraceFile } from '../formats/readTimeDomainPair.js';
import type { TimeUnit } from '../formats/readTimeTrace.js';
import { type Recipe, timeDomainSchema } from '../schema/recipe.js';
import { pinNoiseFloor } from '../spectrum/trace/pinNoiseFloor.js';
import type { MatchUnknown } from './pipeline/types.js';

export interface TimeDomainUnknownInput {
  samples: readonly TraceFile[];
  references: readonly TraceFile[];
  /** The recipe the unknown is matched with; its time-domain step (or the step's defaults) converts the traces. */
  recipe: Recipe;
  /** The name the report records (the first sample's file name, or its path with `--keep-path`). */
  file: string;
  /** SHA-256 of the sample files' bytes followed by the references', in the order given, lowercase hex. */
  hash: string;
}

export interface TimeDomainUnknownOptions {
  /** The delay unit the user gave, overriding the files' headers.
   * @default undefined (the headers, else the step's unit) */
  timeUnit?: TimeUnit;
}

/**
 * The conversion `add --time-domain` stores an entry with: the recipe's step (the library default's, or the step's
 * defaults when the recipe has none), with the default noise-floor factor pinned in as for a new add.
 */
export function timeDomainUnknown(
  input: TimeDomainUnknownInput,
  options: TimeDomainUnknownOptions = {},
): MatchUnknown {
  const { samples, references, recipe } = input;
  if (samples.length === 0 || references.length === 0) {
    throw new BandshelfError('BAD_OPTION', 'a time-domain unknown needs sample and reference trace files', {
      file: input.file,
    });
  }
  const step = pinNoiseFloor(recipe.timeDomain ?? timeDomainSchema.parse({}));
  const result = readTimeDomainPair(
    { samples, references, step },
    options.timeUnit === undefined ? {} : { timeUnit: options.timeUnit },
  );
  return {
    file: input.file,
    hash: input.hash,
    spectrum: result.spectrum,
    warnings: result.warnings.map((w) => (w.line === undefined ? w.message : `line ${w.line}: ${w.message}`)),
  };
}
